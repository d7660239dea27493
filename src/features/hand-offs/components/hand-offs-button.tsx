// The rail's "Hand-offs" button: how many hand-offs addressed to me are unread, and the list
// of them (newest first), each opening its package and marking itself read.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Dialog } from '@/components/ui/dialog';
import { formatDateTime } from '@/lib/format';
import { useHandOffs, useMarkHandOffsRead } from '../api/hand-offs';

export function HandOffsButton() {
  const [open, setOpen] = useState(false);
  const list = useHandOffs();
  const mark = useMarkHandOffsRead();
  const unread = list.data?.unread ?? 0;
  const count = unread > 99 ? '99+' : String(unread);
  return (
    <>
      <button
        type="button"
        onClick={() => setOpen(true)}
        className="flex h-10 w-full items-center justify-between border-l-4 border-transparent pl-4 pr-3 text-left text-sm font-bold text-steel hover:bg-graphite-raised hover:text-chalk"
      >
        <span>Hand-offs</span>
        {unread > 0 && (
          <span className="rounded-sm bg-brass px-1.5 text-[12px] font-black text-graphite tabular">
            {count}
            <span className="sr-only"> unread</span>
          </span>
        )}
      </button>
      {open && (
        <Dialog
          title="Hand-offs to you"
          description={unread > 0 ? `${count} unread. Newest first.` : 'Nothing unread. Newest first.'}
          onClose={() => setOpen(false)}
          width="max-w-[600px]"
        >
          {list.isPending && <p className="text-[13px] text-ink-soft">Loading your hand-offs…</p>}
          {list.isError && (
            <p role="alert" className="text-[13px] font-bold text-fail-ink">
              Your hand-offs could not be loaded. Try again in a moment.
            </p>
          )}
          {list.data && list.data.items.length === 0 && (
            <p className="text-[13px] text-ink-soft">
              Nothing has been handed to you yet. Packages to review, decisions to issue and answered findings
              appear here as the desk hands them over.
            </p>
          )}
          {list.data && list.data.items.length > 0 && (
            <>
              <ul className="flex max-h-[55vh] flex-col overflow-y-auto border border-rule">
                {list.data.items.map((item) => (
                  <li
                    key={item.id}
                    className={`border-b border-rule px-3 py-2 last:border-b-0 ${item.read ? '' : 'border-l-4 border-l-brass bg-sheet-alt'}`}
                  >
                    <p className="text-[12px] font-bold uppercase tracking-[0.05em] text-ink-soft">
                      {item.kind}
                      {!item.read && <span className="sr-only"> (unread)</span>}
                      <span className="font-normal normal-case tracking-normal">
                        {' '}
                        · {formatDateTime(item.at)}
                      </span>
                    </p>
                    {item.packageId ? (
                      <Link
                        to={`/packages/${item.packageId}`}
                        onClick={() => {
                          if (!item.read) mark.mutate({ ids: [item.id] });
                          setOpen(false);
                        }}
                        className={`text-[13.5px] text-verdigris underline underline-offset-2 ${item.read ? '' : 'font-bold'}`}
                      >
                        {item.text}
                      </Link>
                    ) : (
                      <p className="text-[13.5px]">{item.text}</p>
                    )}
                  </li>
                ))}
              </ul>
              <div className="mt-3 flex justify-end">
                <button
                  type="button"
                  disabled={unread === 0 || mark.isPending}
                  onClick={() => mark.mutate({ all: true })}
                  className="h-8 rounded-[3px] border border-rule-strong bg-sheet px-3 text-[13px] font-bold text-ink disabled:opacity-60"
                >
                  Mark all as read
                </button>
              </div>
            </>
          )}
        </Dialog>
      )}
    </>
  );
}

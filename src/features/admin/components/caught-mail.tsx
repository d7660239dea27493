// The demo outbox: what the local SMTP server received, so a demonstration shows every
// message without a real mailbox. A list on the left, the message on the right; HTML
// bodies render in a sandboxed frame (no scripts, no access to this page) and links in
// them open in a new tab.
import { useState } from 'react';
import { formatDateTime } from '@/lib/format';
import { PageLoading } from '@/components/ui/page-loading';
import { EmptyState, ErrorPanel } from '@/components/ui/panel-message';
import { useCaughtMail, type CaughtMail } from '../api/mail';

function Reader({ message }: { message: CaughtMail }) {
  const [view, setView] = useState<'html' | 'text'>(message.html ? 'html' : 'text');
  const shown = message.html ? view : 'text';
  return (
    <article
      aria-label={`Message: ${message.subject}`}
      className="flex min-h-[520px] flex-col border border-rule bg-sheet"
    >
      <header className="border-b border-rule px-4 py-3">
        <h2 className="text-[17px] font-bold leading-snug">{message.subject}</h2>
        <dl className="mt-1.5 grid grid-cols-[72px_1fr] gap-x-2 gap-y-0.5 text-[13px]">
          <dt className="text-ink-soft">From</dt>
          <dd>{message.from}</dd>
          <dt className="text-ink-soft">To</dt>
          <dd>{message.to.join(', ')}</dd>
          <dt className="text-ink-soft">Received</dt>
          <dd className="tabular">{formatDateTime(message.receivedAt)}</dd>
        </dl>
        {message.html && (
          <div
            role="group"
            aria-label="Body format"
            className="mt-2 inline-flex border border-rule-strong text-[13px]"
          >
            {(['html', 'text'] as const).map((option) => (
              <button
                key={option}
                type="button"
                aria-pressed={shown === option}
                onClick={() => setView(option)}
                className={`h-7 px-3 font-bold ${shown === option ? 'bg-ink text-chalk' : 'bg-sheet text-ink hover:bg-sheet-alt'}`}
              >
                {option === 'html' ? 'HTML' : 'Plain text'}
              </button>
            ))}
          </div>
        )}
      </header>
      {shown === 'html' && message.html ? (
        <iframe
          title={`HTML body of ${message.subject}`}
          sandbox="allow-popups allow-popups-to-escape-sandbox"
          srcDoc={`<base target="_blank">${message.html}`}
          className="w-full flex-1 bg-white"
        />
      ) : (
        <pre className="flex-1 whitespace-pre-wrap break-words px-4 py-3 font-mono text-[13px] leading-relaxed">
          {message.text}
        </pre>
      )}
    </article>
  );
}

export function CaughtMailView() {
  const caught = useCaughtMail();
  const [selectedId, setSelectedId] = useState<string | null>(null);

  if (caught.isPending) return <PageLoading label="Opening the demo outbox" />;
  if (caught.isError)
    return <ErrorPanel title="The demo outbox could not be read" message={caught.error.message} />;

  const items = [...caught.data.items].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
  if (items.length === 0) {
    return (
      <EmptyState title="The demo outbox is empty">
        <p>
          Messages appear here as the local mail server receives them — submit a package, assign an engineer
          or invite a person to see one.
        </p>
      </EmptyState>
    );
  }
  const selected = items.find((item) => item.id === selectedId) ?? items[0]!;

  return (
    <div className="grid grid-cols-1 gap-3 lg:grid-cols-[minmax(280px,380px)_minmax(0,1fr)]">
      <ul aria-label="Received messages" className="max-h-[75vh] overflow-y-auto border border-rule bg-sheet">
        {items.map((item) => {
          const active = item.id === selected.id;
          return (
            <li key={item.id} className="border-b border-rule last:border-b-0">
              <button
                type="button"
                aria-current={active ? 'true' : undefined}
                onClick={() => setSelectedId(item.id)}
                className={`block w-full border-l-4 px-3 py-2 text-left ${active ? 'border-l-verdigris bg-verdigris-tint' : 'border-l-transparent hover:bg-sheet-alt'}`}
              >
                <span className="block truncate text-sm font-bold">{item.subject}</span>
                <span className="flex justify-between gap-2 text-[12.5px] text-ink-soft">
                  <span className="truncate">{item.to.join(', ')}</span>
                  <time dateTime={item.receivedAt} className="tabular shrink-0">
                    {formatDateTime(item.receivedAt)}
                  </time>
                </span>
              </button>
            </li>
          );
        })}
      </ul>
      <Reader key={selected.id} message={selected} />
    </div>
  );
}

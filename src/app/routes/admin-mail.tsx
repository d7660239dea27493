// /admin/mail — the mail outbox: every message the desk queued with its status (failures
// with their error, ready to send again), and the demo outbox of what the local mail
// server received. The view, status filter and page live in the URL.
import { Link, useSearchParams } from 'react-router-dom';
import { PageHeader } from '@/components/layouts/page-header';
import type { MailFilters } from '@/lib/query-keys';
import { MailLog } from '@/features/admin/components/mail-log';
import { CaughtMailView } from '@/features/admin/components/caught-mail';

const STATUSES = [
  { value: undefined, label: 'All' },
  { value: 'failed', label: 'Failed' },
  { value: 'queued', label: 'Waiting' },
  { value: 'sent', label: 'Sent' },
] as const;

function tabClass(active: boolean) {
  return `inline-flex h-9 items-center border-b-[3px] px-3 text-sm font-bold ${
    active ? 'border-ink text-ink' : 'border-transparent text-ink-soft hover:text-ink'
  }`;
}

export default function AdminMailRoute() {
  const [params, setParams] = useSearchParams();
  const view = params.get('view') === 'caught' ? 'caught' : 'log';
  const statusParam = params.get('status');
  const status = STATUSES.find((entry) => entry.value === statusParam)?.value;
  const page = Math.max(1, Number.parseInt(params.get('page') ?? '1', 10) || 1);
  const filters: MailFilters = { status, page };

  const set = (changes: Record<string, string | undefined>) =>
    setParams((current) => {
      const next = new URLSearchParams(current);
      for (const [key, value] of Object.entries(changes)) {
        if (value) next.set(key, value);
        else next.delete(key);
      }
      return next;
    });

  return (
    <>
      <PageHeader
        title="Mail outbox"
        context="Hand-off messages and reminders go through a queue with retries; a message that still fails is listed here with the error."
      />
      <nav aria-label="Outbox views" className="mb-3 flex gap-1 border-b border-rule">
        <Link
          to="/admin/mail"
          className={tabClass(view === 'log')}
          aria-current={view === 'log' ? 'page' : undefined}
        >
          Sent by the desk
        </Link>
        <Link
          to="/admin/mail?view=caught"
          className={tabClass(view === 'caught')}
          aria-current={view === 'caught' ? 'page' : undefined}
        >
          Demo outbox
        </Link>
      </nav>
      {view === 'log' ? (
        <>
          <div
            role="group"
            aria-label="Status"
            className="mb-2.5 inline-flex border border-rule-strong bg-sheet text-[13px]"
          >
            {STATUSES.map((entry) => (
              <button
                key={entry.label}
                type="button"
                aria-pressed={status === entry.value}
                onClick={() => set({ status: entry.value, page: undefined })}
                className={`h-8 px-3 font-bold ${
                  status === entry.value ? 'bg-ink text-chalk' : 'text-ink hover:bg-sheet-alt'
                } ${entry.value === 'failed' && status !== 'failed' ? 'text-failed-ink' : ''}`}
              >
                {entry.label}
              </button>
            ))}
          </div>
          <MailLog filters={filters} onPage={(next) => set({ page: next > 1 ? String(next) : undefined })} />
        </>
      ) : (
        <>
          <p className="mb-2.5 text-[13px] text-ink-soft">
            What the local mail server received. In production, with a real mail provider configured, this
            stays empty and messages go to people&apos;s own inboxes.
          </p>
          <CaughtMailView />
        </>
      )}
    </>
  );
}

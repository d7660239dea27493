// Every message the desk queued, newest first: who it went to, which hand-off, and
// whether it went. A message that finally failed stands out with the mail server's error
// and can be queued again.
import { useQueryClient } from '@tanstack/react-query';
import { formatDateTime } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/panel-message';
import { adminKeys, type MailFilters } from '@/lib/query-keys';
import { useMail, useRetryMail, type MailMessage } from '../api/mail';
import { MAIL_EVENT_LABELS } from '../lib/labels';
import { AdminTable, ListStates, type AdminColumn } from './admin-table';

const STATUS_LABELS: Record<MailMessage['status'], string> = {
  queued: 'Waiting to send',
  sent: 'Sent',
  failed: 'Failed',
};

function MailStatus({ status }: { status: MailMessage['status'] }) {
  const style =
    status === 'failed'
      ? 'border-failed-edge bg-failed-tint text-failed-ink'
      : status === 'sent'
        ? 'border-decided-edge bg-decided-tint text-decided-ink'
        : 'border-checking-edge bg-checking-tint text-checking-ink';
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-sm border px-1.5 text-[12.5px] font-bold leading-5 ${style}`}
    >
      <svg
        className="size-3"
        viewBox="0 0 12 12"
        aria-hidden="true"
        fill="none"
        stroke="currentColor"
        strokeWidth="1.5"
      >
        {status === 'failed' ? (
          <>
            <rect x="1.5" y="1.5" width="9" height="9" />
            <path d="M4 4 L8 8 M8 4 L4 8" />
          </>
        ) : status === 'sent' ? (
          <path d="M1.5 6.5 L4.5 9.5 L10.5 2.5" />
        ) : (
          <>
            <circle cx="6" cy="6" r="4.5" />
            <path d="M6 3.5 V6 L7.8 7.2" />
          </>
        )}
      </svg>
      {STATUS_LABELS[status]}
    </span>
  );
}

function RetryButton({ message }: { message: MailMessage }) {
  const retry = useRetryMail();
  return (
    <span className="flex flex-col items-end gap-0.5">
      <Button
        size="sm"
        disabled={retry.isPending || retry.isSuccess}
        onClick={() => retry.mutate(message.id)}
        aria-label={`Send again: ${message.subject} to ${message.to}`}
      >
        {retry.isPending ? 'Queuing…' : retry.isSuccess ? 'Queued again' : 'Send again'}
      </Button>
      {retry.isError && (
        <span role="alert" className="text-[12.5px] font-bold text-failed-ink">
          {retry.error.message}
        </span>
      )}
    </span>
  );
}

export function MailLog({ filters, onPage }: { filters: MailFilters; onPage: (page: number) => void }) {
  const mail = useMail(filters);
  return (
    <ListStates
      query={mail}
      loading="Loading the mail log"
      failed="The mail log could not be loaded"
      isEmpty={(data) => data.items.length === 0}
      empty={
        <EmptyState
          title={
            filters.status ? `No ${STATUS_LABELS[filters.status].toLowerCase()} messages` : 'No mail yet'
          }
        >
          <p>
            Messages are queued at each hand-off: a package submitted, an engineer assigned, a decision
            recorded, a decision returned, a finding answered, a package resubmitted, the daily lift-date
            reminder, and invitations.
          </p>
        </EmptyState>
      }
    >
      {({ items, total }) => <MailPage items={items} total={total} filters={filters} onPage={onPage} />}
    </ListStates>
  );
}

const COLUMNS: AdminColumn[] = [
  { label: 'Status' },
  { label: 'Message' },
  { label: 'To' },
  { label: 'Attempts', className: 'text-right' },
  { label: 'Queued' },
  { label: 'Sent' },
  { label: 'Actions', hidden: true },
];

function MailPage({
  items,
  total,
  filters,
  onPage,
}: {
  items: MailMessage[];
  total: number;
  filters: MailFilters;
  onPage: (page: number) => void;
}) {
  const queryClient = useQueryClient();

  // The server pages by a fixed size: the first page's length is that size.
  const firstPage = queryClient.getQueryData<{ items: unknown[] }>(
    adminKeys.mailList({ ...filters, page: 1 }),
  );
  const pageSize = Math.max(firstPage?.items.length ?? 0, items.length, 1);
  const from = (filters.page - 1) * pageSize + 1;
  const to = from + items.length - 1;
  const hasNext = to < total;

  return (
    <>
      <AdminTable caption="Mail messages" columns={COLUMNS}>
        {items.map((message) => {
          const failed = message.status === 'failed';
          return (
            <tr
              key={message.id}
              data-status={message.status}
              className={`border-b border-rule align-top last:border-b-0 ${failed ? 'border-l-4 border-l-failed-ink bg-failed-tint/55' : ''}`}
            >
              <td className="px-3 py-2">
                <MailStatus status={message.status} />
              </td>
              <td className="px-3 py-2">
                <span className="block text-[12px] font-bold uppercase tracking-[0.05em] text-ink-soft">
                  {MAIL_EVENT_LABELS[message.event]}
                </span>
                <span className="block">{message.subject}</span>
                {failed && message.lastError && (
                  <p className="mt-1 font-mono text-[12.5px] font-bold text-failed-ink">
                    <span className="font-sans">Error: </span>
                    {message.lastError}
                  </p>
                )}
              </td>
              <td className="break-all px-3 py-2 text-[13px]">{message.to}</td>
              <td className="tabular px-3 py-2 text-right">{message.attempts}</td>
              <td className="tabular whitespace-nowrap px-3 py-2 text-[13px]">
                {formatDateTime(message.createdAt)}
              </td>
              <td className="tabular whitespace-nowrap px-3 py-2 text-[13px]">
                {formatDateTime(message.sentAt)}
              </td>
              <td className="px-3 py-2 text-right">{failed && <RetryButton message={message} />}</td>
            </tr>
          );
        })}
      </AdminTable>
      <nav aria-label="Pages" className="mt-2 flex items-center justify-between text-[13px]">
        <p className="tabular text-ink-soft">
          Messages{' '}
          <strong className="text-ink">
            {from}–{to}
          </strong>{' '}
          of <strong className="text-ink">{total}</strong>
        </p>
        <div className="flex gap-2">
          <Button size="sm" disabled={filters.page <= 1} onClick={() => onPage(filters.page - 1)}>
            Newer
          </Button>
          <Button size="sm" disabled={!hasNext} onClick={() => onPage(filters.page + 1)}>
            Older
          </Button>
        </div>
      </nav>
    </>
  );
}

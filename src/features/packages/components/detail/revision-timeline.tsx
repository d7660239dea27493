// The package's history: each revision with its state and check, and the events (created,
// saved, submitted, checked, assigned, decided…) in time order, newest first.
import { DECISION_LABELS } from '@shared/schemas/common';
import type { PackageDetail } from '@shared/schemas/packages';
import { auditActionWords } from '@shared/rules/audit-actions';
import { formatDateTime } from '@/lib/format';

const DECISION_WORDS: Record<string, string> = DECISION_LABELS;

const SEVERITY_WORDS: Record<string, string> = {
  note: 'note',
  minor: 'minor',
  major: 'major',
  blocking: 'blocking',
};

const CHECK_WORDS: Record<string, string> = {
  none: 'not run',
  queued: 'queued',
  running: 'running',
  done: 'done',
  invalid: 'could not run',
  failed: 'failed',
};

function detailText(detail: Record<string, unknown>): string {
  const parts: string[] = [];
  const text = (key: string) => {
    const value = detail[key];
    return typeof value === 'string' || typeof value === 'number' ? String(value) : null;
  };
  const engineer = text('engineer');
  if (engineer) parts.push(engineer);
  const decision = text('decision');
  if (decision) parts.push(DECISION_WORDS[decision] ?? decision);
  const severity = text('severity');
  if (severity) parts.push(SEVERITY_WORDS[severity] ?? severity);
  const figure = text('figure');
  if (figure) parts.push(`figure ${figure}`);
  for (const key of ['revision', 'number']) {
    const value = text(key);
    if (value) parts.push(`revision ${value}`);
  }
  const from = text('from');
  if (from) parts.push(`from revision ${from}`);
  const pages = text('pages');
  if (pages) parts.push(`${pages} pages`);
  const openDiscrepancies = detail.openDiscrepancies;
  if (typeof openDiscrepancies === 'number' && openDiscrepancies > 0)
    parts.push(`${openDiscrepancies} open ${openDiscrepancies === 1 ? 'discrepancy' : 'discrepancies'}`);
  for (const key of ['fileName', 'name', 'originalName', 'reason', 'message']) {
    const value = text(key);
    if (value) parts.push(value);
  }
  // An acceptance over items that stood against it: how many, and the engineer's reason.
  const overrideReason = text('overrideReason');
  if (overrideReason) {
    const n = typeof detail.overridden === 'number' ? detail.overridden : null;
    const items = n === null ? '' : ` ${n} ${n === 1 ? 'item' : 'items'}`;
    parts.push(`overrode${items}: ${overrideReason}`);
  }
  return parts.join(' · ');
}

export function RevisionTimeline({ detail }: { detail: PackageDetail }) {
  const events = [...detail.events].sort((a, b) => b.at.localeCompare(a.at));
  return (
    <section aria-labelledby="timeline-title" className="border border-rule bg-sheet">
      <h2 id="timeline-title" className="border-b border-rule px-3 py-2 text-[14px] font-bold">
        Revisions and history
      </h2>
      <ol className="flex flex-col">
        {[...detail.revisions]
          .sort((a, b) => b.number - a.number)
          .map((revision) => (
            <li
              key={revision.id}
              className="flex items-baseline gap-2 border-b border-rule px-3 py-1.5 text-[13px]"
            >
              <span className="font-mono font-bold">R{revision.number}</span>
              <span className={revision.state === 'draft' ? 'text-ink-soft' : 'font-bold'}>
                {revision.state === 'draft' ? 'Draft' : `Submitted ${formatDateTime(revision.submittedAt)}`}
              </span>
              <span className="ml-auto text-[12px] text-ink-soft">
                check {CHECK_WORDS[revision.checkStatus]}
              </span>
            </li>
          ))}
      </ol>
      {events.length > 0 && (
        <ol className="relative flex max-h-[22rem] flex-col overflow-y-auto px-3 py-2" aria-label="Events">
          {events.map((event) => {
            const extra = detailText(event.detail);
            return (
              <li key={event.id} className="relative border-l-2 border-rule pb-2 pl-3 text-[13px] last:pb-0">
                <span
                  className="absolute -left-[5px] top-1.5 size-2 rounded-full border-2 border-ink bg-sheet"
                  aria-hidden="true"
                />
                <span className="font-bold">{auditActionWords(event.action)}</span>
                {extra && <span className="text-ink-soft"> · {extra}</span>}
                <span className="block text-[12px] text-ink-soft">
                  {formatDateTime(event.at)}
                  {event.actor && <> · {event.actor}</>}
                </span>
              </li>
            );
          })}
        </ol>
      )}
    </section>
  );
}

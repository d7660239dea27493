// Counts by status across the top of a list; each count is also the quickest way to
// filter the list to that status (press again to show all). With filters the kept counts cannot
// answer and more matching packages than the server counts, each count says "at least".
import { PACKAGE_STATUSES, PACKAGE_STATUS_LABELS, type PackageStatus } from '@shared/schemas/common';
import { StatusShape } from '@/components/ui/status-badge';

const INK: Record<PackageStatus, string> = {
  draft: 'text-draft-ink',
  checking: 'text-checking-ink',
  check_failed: 'text-failed-ink',
  ready_for_review: 'text-ready-ink',
  with_engineer: 'text-engineer-ink',
  decided: 'text-decided-ink',
  returned: 'text-ink',
};

export function StatusCounts({
  counts,
  overLimit = [],
  limit = 0,
  active,
  onSelect,
  statuses = PACKAGE_STATUSES,
}: {
  counts: Record<string, number>;
  /** Statuses whose count is a lower bound ("at least"); `limit` is how many were counted. */
  overLimit?: readonly string[];
  limit?: number;
  active: PackageStatus | undefined;
  onSelect: (status: PackageStatus | undefined) => void;
  statuses?: readonly PackageStatus[];
}) {
  const total = statuses.reduce((sum, status) => sum + (counts[status] ?? 0), 0);
  const anyOver = statuses.some((status) => overLimit.includes(status));
  const figure = (n: number, over: boolean) =>
    over ? (
      <span className="text-[22px] font-black leading-none tabular">
        <span className="text-[12px] font-bold">at least </span>
        {n.toLocaleString('en-GB')}
      </span>
    ) : (
      <span className="text-[22px] font-black leading-none tabular">{n}</span>
    );
  const tile = (selected: boolean) =>
    `flex flex-1 flex-col items-start gap-0.5 border-r border-rule px-3 py-2 text-left last:border-r-0 hover:bg-sheet-alt ${
      selected ? 'bg-sheet shadow-[inset_0_-3px_0_var(--color-ink)]' : ''
    }`;

  return (
    <div
      role="group"
      aria-label="Packages by status"
      className="mb-3 flex flex-wrap border border-rule bg-sheet"
    >
      <button
        type="button"
        aria-pressed={active === undefined}
        onClick={() => onSelect(undefined)}
        className={tile(active === undefined)}
      >
        <span className="text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">All</span>
        {figure(total, anyOver)}
      </button>
      {statuses.map((status) => (
        <button
          key={status}
          type="button"
          aria-pressed={active === status}
          onClick={() => onSelect(active === status ? undefined : status)}
          className={tile(active === status)}
        >
          <span
            className={`inline-flex items-center gap-1 whitespace-nowrap text-[12px] font-bold ${INK[status]}`}
          >
            <StatusShape status={status} />
            {PACKAGE_STATUS_LABELS[status]}
          </span>
          {figure(counts[status] ?? 0, overLimit.includes(status))}
        </button>
      ))}
      {anyOver && (
        <p className="basis-full border-t border-rule px-3 py-1 text-[12.5px] text-ink-soft">
          More than {limit.toLocaleString('en-GB')} packages match these filters: the desk counts that many,
          so each count is the least there are.
        </p>
      )}
    </div>
  );
}

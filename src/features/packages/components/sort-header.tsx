// The sortable column headers of the package table: which columns sort, what the first press
// gives (the useful order: counts most-first, dates and references earliest-first), and the
// words that say what the next press will do.
import type { PackageSort } from '../hooks/use-package-list-params';

type SortableColumn =
  'reference' | 'plannedLiftDate' | 'reviewDue' | 'updatedAt' | 'openDiscrepancies' | 'revision';

/** Table column id → the server's sort field. */
export const SORTABLE: Record<string, SortableColumn> = {
  reference: 'reference',
  plannedLiftDate: 'plannedLiftDate',
  reviewDue: 'reviewDue',
  updatedAt: 'updatedAt',
  check: 'openDiscrepancies',
  revision: 'revision',
};

const MOST_FIRST: ReadonlySet<SortableColumn> = new Set(['openDiscrepancies', 'revision']);
const SORT_WORDS: Record<SortableColumn, [string, string]> = {
  reference: ['reference, A to Z', 'reference, Z to A'],
  plannedLiftDate: ['planned lift, earliest first', 'planned lift, latest first'],
  reviewDue: ['review due, earliest first', 'review due, latest first'],
  updatedAt: ['last update, oldest first', 'last update, newest first'],
  openDiscrepancies: ['open discrepancies, fewest first', 'open discrepancies, most first'],
  revision: ['revision, lowest first', 'revision, highest first'],
};

export function ariaSort(
  columnId: string,
  sort: PackageSort,
): 'ascending' | 'descending' | 'none' | undefined {
  const field = SORTABLE[columnId];
  if (!field) return undefined;
  return sort === field ? 'ascending' : sort === `-${field}` ? 'descending' : 'none';
}

export function SortHeader({
  label,
  field,
  sort,
  onSortChange,
}: {
  label: string;
  field: SortableColumn;
  sort: PackageSort;
  onSortChange: (sort: PackageSort) => void;
}) {
  const active = sort === field || sort === `-${field}`;
  const descending = sort === `-${field}`;
  // The first press gives the useful order; the next press turns it round.
  const nextDescending = active ? !descending : MOST_FIRST.has(field);
  const nextSort = (nextDescending ? `-${field}` : field) as PackageSort;
  return (
    <button
      type="button"
      onClick={() => onSortChange(nextSort)}
      className={`inline-flex items-center gap-1 font-bold uppercase tracking-[0.06em] hover:text-verdigris ${active ? 'text-ink' : ''}`}
      title={`Sort by ${SORT_WORDS[field][nextDescending ? 1 : 0]}`}
    >
      {label}
      <svg className="size-3" viewBox="0 0 12 12" aria-hidden="true" fill="currentColor">
        <path d="M6 1.5 L9.5 5 H2.5 Z" opacity={active && !descending ? 1 : 0.3} />
        <path d="M6 10.5 L2.5 7 H9.5 Z" opacity={active && descending ? 1 : 0.3} />
      </svg>
    </button>
  );
}

// The admin pages' lists (organisations, sites, people, mail): one table look with a caption
// for screen readers and a header row, and the three states a list query passes through before
// it has rows to show (loading, failed, empty), so each page says only what is its own.
import type { ReactNode } from 'react';
import { PageLoading } from '@/components/ui/page-loading';
import { ErrorPanel } from '@/components/ui/panel-message';

export interface AdminColumn {
  label: string;
  /** Width or alignment classes of the header cell. */
  className?: string;
  /** The label is for screen readers only (the actions column). */
  hidden?: boolean;
}

export function AdminTable({
  caption,
  columns,
  children,
}: {
  caption: string;
  columns: readonly AdminColumn[];
  /** The body's rows. */
  children: ReactNode;
}) {
  return (
    <table className="w-full border-collapse border border-rule bg-sheet text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead className="bg-sheet-alt text-left text-[12.5px] uppercase tracking-[0.06em] text-ink-soft">
        <tr className="border-b border-rule">
          {columns.map((column) => (
            <th
              key={column.label}
              scope="col"
              className={['px-3 py-2', column.hidden ? '' : 'font-bold', column.className ?? '']
                .filter(Boolean)
                .join(' ')}
            >
              {column.hidden ? <span className="sr-only">{column.label}</span> : column.label}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}

/** What a list page needs of its query (TanStack Query's result has it). */
interface ListQuery<T> {
  isPending: boolean;
  isError: boolean;
  error: Error | null;
  data: T | undefined;
}

/**
 * The loading line, the error panel, `empty` when the loaded data has nothing to show, or else
 * the content `children` makes of the data.
 */
export function ListStates<T>({
  query,
  loading,
  failed,
  isEmpty,
  empty,
  children,
}: {
  query: ListQuery<T>;
  /** "Loading organisations" */
  loading: string;
  /** "Organisations could not be loaded" */
  failed: string;
  isEmpty: (data: T) => boolean;
  empty: ReactNode;
  children: (data: T) => ReactNode;
}) {
  if (query.isPending) return <PageLoading label={loading} />;
  if (query.isError || query.data === undefined)
    return <ErrorPanel title={failed} message={query.error?.message ?? 'Try again.'} />;
  return <>{isEmpty(query.data) ? empty : children(query.data)}</>;
}

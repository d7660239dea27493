// A whole package list: counts by status, search and status filter, the table and the
// pager, all driven by the URL's search parameters and one query. The queue pages add
// their own filters, a bar for the selected rows and an engineer column through slots.
import { useCallback, type ReactNode } from 'react';
import type { Role } from '@shared/schemas/common';
import type { PackageSummary } from '@shared/schemas/packages';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { PageLoading, Spinner } from '@/components/ui/page-loading';
import { EmptyState, ErrorPanel } from '@/components/ui/panel-message';
import { usePackages } from '../api/get-packages';
import { isFiltered, NO_FILTERS, usePackageListParams } from '../hooks/use-package-list-params';
import type { PackageTableVariant } from './package-columns';
import { PackageTable, type RowSelection } from './package-table';
import { StatusCounts } from './status-counts';
import { PackageFilters } from './package-filters';
import { Pager } from './pager';

export function PackageListView({
  role,
  variant,
  caption,
  emptyTitle,
  emptyBody,
  moreFilters,
  aboveTable,
  selection,
  engineerCell,
}: {
  role: Role;
  variant: PackageTableVariant;
  caption: string;
  /** Shown when nothing at all is in this person's list (no filters on). */
  emptyTitle: string;
  emptyBody: ReactNode;
  /** Further filter controls, shown under the search and status. */
  moreFilters?: ReactNode;
  /** Shown between the filters and the table (e.g. what to do with the selected rows). */
  aboveTable?: ReactNode;
  selection?: RowSelection;
  engineerCell?: (pkg: PackageSummary) => ReactNode;
}) {
  const { filters, update } = usePackageListParams();
  const query = usePackages(filters);
  const onSearch = useCallback((q: string) => update({ q }, { replace: true }), [update]);

  const filtered = isFiltered(filters);
  const data = query.data;
  // With nothing at all in the list, counts of zero and filters only get in the way.
  const nothingYet = data !== undefined && data.total === 0 && !filtered;

  return (
    <section aria-label={caption}>
      {data && !nothingYet && (
        <StatusCounts
          counts={data.countsByStatus}
          overLimit={data.countsOverLimit}
          limit={data.countLimit}
          active={filters.status}
          onSelect={(status) => update({ status })}
        />
      )}
      {!nothingYet && (
        <PackageFilters
          q={filters.q}
          status={filters.status}
          onSearch={onSearch}
          onStatus={(status) => update({ status })}
        />
      )}
      {!nothingYet && moreFilters}
      {aboveTable}

      {query.isPending && <PageLoading label="Loading packages" />}

      {query.isError && (
        <ErrorPanel
          title="The package list could not be loaded"
          message={
            isApiError(query.error) ? query.error.message : 'Something went wrong while loading the list.'
          }
          action={
            <Button size="sm" onClick={() => query.refetch()}>
              Try again
            </Button>
          }
        />
      )}

      {nothingYet && <EmptyState title={emptyTitle}>{emptyBody}</EmptyState>}

      {data && data.items.length === 0 && filtered && (
        <EmptyState title="No package matches these filters">
          <p>
            Nothing in your list matches
            {filters.q ? ` “${filters.q}”` : ''}
            {isFiltered({ ...filters, q: undefined }) ? ' with the filters that are on' : ''}.{' '}
            <button
              type="button"
              className="font-bold text-verdigris underline underline-offset-2"
              onClick={() => update(NO_FILTERS)}
            >
              Clear the filters
            </button>{' '}
            to see every package again.
          </p>
        </EmptyState>
      )}

      {data && data.items.length > 0 && (
        <>
          <div className="mb-1.5 flex items-center justify-between text-[12.5px] text-ink-soft">
            <span>
              <kbd className="font-mono">j</kbd>/<kbd className="font-mono">k</kbd> or ↑/↓ to move ·{' '}
              <kbd className="font-mono">Enter</kbd> to open
              {selection && (
                <>
                  {' '}
                  · <kbd className="font-mono">x</kbd> to select, shift-click for a range
                </>
              )}{' '}
              · <kbd className="font-mono">/</kbd> to search
            </span>
            {query.isFetching && (
              <span className="inline-flex items-center gap-1.5" role="status">
                <Spinner className="size-3.5" /> Updating
              </span>
            )}
          </div>
          <PackageTable
            items={data.items}
            role={role}
            variant={variant}
            sort={filters.sort}
            onSortChange={(sort) => update({ sort })}
            busy={query.isPlaceholderData}
            caption={caption}
            selection={selection}
            engineerCell={engineerCell}
          />
          <Pager
            page={data.page}
            pageSize={data.pageSize}
            total={data.total}
            totalOverLimit={data.totalOverLimit}
            nextCursor={data.nextCursor}
            previousCursor={data.previousCursor}
            shown={data.items.length}
            onPage={(page, cursor) => update({ page, cursor })}
            onPageSize={(pageSize) => update({ pageSize })}
          />
        </>
      )}
    </section>
  );
}

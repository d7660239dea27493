// GET /api/packages: one page of the lift packages this person may see, with counts by
// status. The server scopes the list by role (organisation, site, assignment); a page after the
// first is asked for by the cursor the page before gave (keyset paging), its number only shown.
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { PackageListResponse } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys, type PackageListFilters } from '@/lib/query-keys';

export function getPackages(filters: PackageListFilters, signal?: AbortSignal): Promise<PackageListResponse> {
  // The order of the parameters is fixed, so the same filters always give the same URL.
  return api.get('/api/packages', PackageListResponse, {
    signal,
    query: {
      status: filters.status,
      siteId: filters.siteId,
      contractorId: filters.contractorId,
      engineerId: filters.engineerId,
      critical: filters.critical === undefined ? undefined : String(filters.critical),
      discrepancies: filters.discrepancies === undefined ? undefined : String(filters.discrepancies),
      liftWithinDays: filters.liftWithinDays,
      revisionMin: filters.revisionMin,
      q: filters.q,
      sort: filters.sort,
      cursor: filters.cursor,
      page: filters.page,
      pageSize: filters.pageSize,
    },
  });
}

export const packagesQueryOptions = (filters: PackageListFilters) =>
  queryOptions({
    queryKey: packageKeys.list(filters),
    queryFn: ({ signal }) => getPackages(filters, signal),
    // Keep the previous page on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export function usePackages(filters: PackageListFilters) {
  return useQuery(packagesQueryOptions(filters));
}

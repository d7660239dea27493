// GET /api/packages/:id: the package, its revisions and events, and the current revision
// with its inputs, files, check run and results. The server answers 404 for a package
// outside this person's scope. While the check is queued or running the query polls.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { PackageDetail } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';

export const CHECK_POLL_MS = 1500;

export function getPackage(id: string, signal?: AbortSignal): Promise<PackageDetail> {
  return api.get(`/api/packages/${encodeURIComponent(id)}`, PackageDetail, { signal });
}

export function isCheckInProgress(detail: PackageDetail | undefined): boolean {
  const status = detail?.current.check.status;
  return status === 'queued' || status === 'running';
}

export const packageQueryOptions = (id: string) =>
  queryOptions({
    queryKey: packageKeys.detail(id),
    queryFn: ({ signal }) => getPackage(id, signal),
    refetchInterval: (query) => (isCheckInProgress(query.state.data) ? CHECK_POLL_MS : false),
  });

export function usePackage(id: string) {
  return useQuery(packageQueryOptions(id));
}

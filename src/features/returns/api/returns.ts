// Stamped returns of a package: GET /api/packages/:id/returns lists them (newest first),
// POST issues one for the recorded decision (202, built by a background job). While one
// is being built the list is asked for again every second; when it is ready the package
// itself (now "returned") is read again.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ReturnList, StampedReturn } from '@shared/schemas/returns';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';

export const POLL_MS = 1000;

export function returnFileUrl(packageId: string, returnId: string): string {
  return `/api/packages/${packageId}/returns/${returnId}/file`;
}

export function verifyPath(code: string): string {
  return `/verify/${code}`;
}

export function getReturns(packageId: string, signal?: AbortSignal): Promise<ReturnList> {
  return api.get(`/api/packages/${packageId}/returns`, ReturnList, { signal });
}

export const returnsQueryOptions = (packageId: string) =>
  queryOptions({
    queryKey: packageKeys.returns(packageId),
    queryFn: ({ signal }) => getReturns(packageId, signal),
    refetchInterval: (query) =>
      query.state.data?.items.some((r) => r.state === 'pending') ? POLL_MS : false,
  });

export function useReturns(packageId: string) {
  return useQuery(returnsQueryOptions(packageId));
}

export function issueReturn(packageId: string): Promise<StampedReturn> {
  return api.post(`/api/packages/${packageId}/returns`, undefined, StampedReturn);
}

export function useIssueReturn(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => issueReturn(packageId),
    onSuccess: (created) => {
      // Show the new return at once; the list query then follows its progress.
      queryClient.setQueryData<ReturnList>(packageKeys.returns(packageId), (old) => ({
        items: [created, ...(old?.items ?? []).filter((r) => r.id !== created.id)],
      }));
      return queryClient.invalidateQueries({ queryKey: packageKeys.returns(packageId), exact: true });
    },
  });
}

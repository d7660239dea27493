// The one client of a package's findings, read by the review workspace and by the
// contractor's returns page alike: GET /api/packages/:id/findings (every revision's, with
// its state and the contractor's answer), POST a new one, PATCH one (the engineer opens or
// closes it; the contractor answers it). Every write answers the whole list, which replaces
// the cached one under packageKeys.findings.
import { queryOptions, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { FindingList, type Finding, type FindingBody } from '@shared/schemas/reviews';
import { api, isApiError, request } from './api-client';
import { packageKeys } from './query-keys';

export function packagePath(packageId: string): string {
  return `/api/packages/${encodeURIComponent(packageId)}`;
}

/**
 * A 409 that says the review moved on under the engineer (the return was requested, or the
 * package went to another engineer): the package is fetched again so the workspace closes its
 * controls; the error's own sentence stays on screen.
 */
export function refetchIfReviewClosed(queryClient: QueryClient, packageId: string, error: unknown) {
  if (isApiError(error) && error.status === 409 && ['return_issued', 'reassigned'].includes(error.code))
    void queryClient.invalidateQueries({ queryKey: packageKeys.detail(packageId) });
}

export function getFindings(packageId: string, signal?: AbortSignal): Promise<Finding[]> {
  return api.get(`${packagePath(packageId)}/findings`, FindingList, { signal }).then((list) => list.items);
}

export const findingsQueryOptions = (packageId: string) =>
  queryOptions({
    queryKey: packageKeys.findings(packageId),
    queryFn: ({ signal }) => getFindings(packageId, signal),
  });

export function useFindings(packageId: string) {
  return useQuery(findingsQueryOptions(packageId));
}

export function createFinding(packageId: string, body: FindingBody): Promise<Finding[]> {
  return api.post(`${packagePath(packageId)}/findings`, body, FindingList).then((list) => list.items);
}

/** The one PATCH: the engineer sends `{state}`, the contractor `{response}`. */
export type FindingPatch = { state: 'open' | 'closed' } | { response: string };

export function patchFinding(packageId: string, findingId: string, body: FindingPatch): Promise<Finding[]> {
  return request(
    `${packagePath(packageId)}/findings/${encodeURIComponent(findingId)}`,
    { method: 'PATCH', body },
    FindingList,
  ).then((list) => list.items);
}

export function useCreateFinding(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: FindingBody) => createFinding(packageId, body),
    onSuccess: (items) => queryClient.setQueryData(packageKeys.findings(packageId), items),
    onError: (error) => refetchIfReviewClosed(queryClient, packageId, error),
  });
}

/** The engineer opens or closes a finding. */
export function useSetFindingState(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ findingId, state }: { findingId: string; state: 'open' | 'closed' }) =>
      patchFinding(packageId, findingId, { state }),
    onSuccess: (items) => queryClient.setQueryData(packageKeys.findings(packageId), items),
    onError: (error) => refetchIfReviewClosed(queryClient, packageId, error),
  });
}

/** The contractor answers a finding; the package's history gains a "finding answered" line. */
export function useAnswerFinding(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ findingId, response }: { findingId: string; response: string }) =>
      patchFinding(packageId, findingId, { response }),
    onSuccess: (items) => {
      queryClient.setQueryData(packageKeys.findings(packageId), items);
      return queryClient.invalidateQueries({ queryKey: packageKeys.detail(packageId), exact: true });
    },
  });
}

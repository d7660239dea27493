// GET /api/packages/:id/findings (every revision's, with its state and the contractor's
// answer), POST a new one and PATCH one open or closed. Both writes answer the whole list.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { FindingList, type Finding, type FindingBody } from '@shared/schemas/reviews';
import { api, request } from '@/lib/api-client';
import { packagePath, refetchIfReviewClosed, reviewKeys } from './review-keys';

export function getFindings(packageId: string, signal?: AbortSignal): Promise<Finding[]> {
  return api.get(`${packagePath(packageId)}/findings`, FindingList, { signal }).then((list) => list.items);
}

export const findingsQueryOptions = (packageId: string) =>
  queryOptions({
    queryKey: reviewKeys.findings(packageId),
    queryFn: ({ signal }) => getFindings(packageId, signal),
  });

export function useFindings(packageId: string) {
  return useQuery(findingsQueryOptions(packageId));
}

export function createFinding(packageId: string, body: FindingBody): Promise<Finding[]> {
  return api.post(`${packagePath(packageId)}/findings`, body, FindingList).then((list) => list.items);
}

export function useCreateFinding(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: FindingBody) => createFinding(packageId, body),
    onSuccess: (items) => queryClient.setQueryData(reviewKeys.findings(packageId), items),
    onError: (error) => refetchIfReviewClosed(queryClient, packageId, error),
  });
}

export function setFindingState(
  packageId: string,
  findingId: string,
  state: 'open' | 'closed',
): Promise<Finding[]> {
  return request(
    `${packagePath(packageId)}/findings/${encodeURIComponent(findingId)}`,
    { method: 'PATCH', body: { state } },
    FindingList,
  ).then((list) => list.items);
}

export function useSetFindingState(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ findingId, state }: { findingId: string; state: 'open' | 'closed' }) =>
      setFindingState(packageId, findingId, state),
    onSuccess: (items) => queryClient.setQueryData(reviewKeys.findings(packageId), items),
    onError: (error) => refetchIfReviewClosed(queryClient, packageId, error),
  });
}

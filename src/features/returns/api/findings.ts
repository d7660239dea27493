// The engineer's findings on a package (every revision) and the contractor's answers:
// GET /api/packages/:id/findings, PATCH /api/packages/:id/findings/:findingId {response}.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { FindingList, type Finding } from '@shared/schemas/reviews';
import { api, request } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-client';

// The cache holds the list itself (Finding[]), the same shape the review workspace keeps
// under this key, so both pages can share it.
export function getFindings(packageId: string, signal?: AbortSignal): Promise<Finding[]> {
  return api.get(`/api/packages/${packageId}/findings`, FindingList, { signal }).then((list) => list.items);
}

export const findingsQueryOptions = (packageId: string) =>
  queryOptions({
    queryKey: packageKeys.findings(packageId),
    queryFn: ({ signal }) => getFindings(packageId, signal),
  });

export function useFindings(packageId: string) {
  return useQuery(findingsQueryOptions(packageId));
}

export function answerFinding(packageId: string, findingId: string, response: string): Promise<Finding[]> {
  return request(
    `/api/packages/${packageId}/findings/${findingId}`,
    { method: 'PATCH', body: { response } },
    FindingList,
  ).then((list) => list.items);
}

export function useAnswerFinding(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ findingId, response }: { findingId: string; response: string }) =>
      answerFinding(packageId, findingId, response),
    onSuccess: (items) => {
      queryClient.setQueryData(packageKeys.findings(packageId), items);
      // The package's history gains a "finding answered" line.
      return queryClient.invalidateQueries({ queryKey: packageKeys.detail(packageId), exact: true });
    },
  });
}

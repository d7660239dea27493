// GET /api/packages/:id/stamp-placement (where the stamp block lands on page 1 of the plan),
// PUT the engineer's placement (400 off the page, 422 over the plan's content, 409 once the
// return is requested) and DELETE it (the desk chooses again).
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { StampPlacementView, type StampPlacementBody } from '@shared/schemas/stamp-placement';
import { api, request } from '@/lib/api-client';
import { packagePath, refetchIfReviewClosed } from '@/lib/findings-client';
import { packageKeys } from '@/lib/query-keys';

const path = (packageId: string) => `${packagePath(packageId)}/stamp-placement`;

export const stampPlacementQueryOptions = (packageId: string) =>
  queryOptions({
    queryKey: packageKeys.stampPlacement(packageId),
    queryFn: ({ signal }) => api.get(path(packageId), StampPlacementView, { signal }),
  });

export function useStampPlacement(packageId: string, enabled: boolean) {
  return useQuery({ ...stampPlacementQueryOptions(packageId), enabled });
}

export function useChangeStampPlacement(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: StampPlacementBody | null) =>
      body
        ? api.put(path(packageId), body, StampPlacementView)
        : request(path(packageId), { method: 'DELETE' }, StampPlacementView),
    onSuccess: (view) => queryClient.setQueryData(packageKeys.stampPlacement(packageId), view),
    onError: (error) => refetchIfReviewClosed(queryClient, packageId, error),
  });
}

// POST /api/packages/:id/revisions: after "Revise and resubmit" or "Rejected", the
// contractor starts the next revision — a draft with the previous inputs and no files.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PackageDetail } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';

export function startRevision(packageId: string): Promise<PackageDetail> {
  return api.post(`/api/packages/${packageId}/revisions`, undefined, PackageDetail);
}

export function useStartRevision(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => startRevision(packageId),
    onSuccess: (detail) => {
      queryClient.setQueryData(packageKeys.detail(packageId), detail);
      return queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
    },
  });
}

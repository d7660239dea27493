// POST /api/packages/:id/duplicate: a new draft with the same inputs, titled "… (copy)".
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PackageDetail } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';

export function duplicatePackage(id: string): Promise<PackageDetail> {
  return api.post(`/api/packages/${encodeURIComponent(id)}/duplicate`, undefined, PackageDetail);
}

export function useDuplicatePackage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: duplicatePackage,
    onSuccess: (detail) => {
      queryClient.setQueryData(packageKeys.detail(detail.package.id), detail);
      return queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
    },
  });
}

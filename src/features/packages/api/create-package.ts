// POST /api/packages: a new draft lift package (revision 1, empty inputs).
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PackageDetail, type CreatePackageBody } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';

export function createPackage(body: CreatePackageBody): Promise<PackageDetail> {
  return api.post('/api/packages', body, PackageDetail);
}

export function useCreatePackage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createPackage,
    onSuccess: (detail) => {
      queryClient.setQueryData(packageKeys.detail(detail.package.id), detail);
      return queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
    },
  });
}

// POST /api/packages/:id/submit: freezes the current revision and queues the check run.
// 400 carries field errors (paths like 'inputs.crane.boomLength') or lift_plan_missing.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PackageDetail } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';

export function submitPackage(id: string): Promise<PackageDetail> {
  return api.post(`/api/packages/${encodeURIComponent(id)}/submit`, undefined, PackageDetail);
}

export function useSubmitPackage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: submitPackage,
    onSuccess: (detail) => {
      queryClient.setQueryData(packageKeys.detail(detail.package.id), detail);
      return queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
    },
  });
}

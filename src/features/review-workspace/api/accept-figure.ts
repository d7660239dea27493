// POST /api/packages/:id/accepted-figures: the engineer accepts a stated figure that
// disagrees with the recomputation, with a reason. Answers the package detail.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PackageDetail } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';
import { packagePath, refetchIfReviewClosed } from '@/lib/findings-client';

export type AcceptFigureInput = { figure: string; reason: string };

export function acceptFigure(packageId: string, body: AcceptFigureInput): Promise<PackageDetail> {
  return api.post(`${packagePath(packageId)}/accepted-figures`, body, PackageDetail);
}

export function useAcceptFigure(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptFigureInput) => acceptFigure(packageId, body),
    onSuccess: (detail) => {
      queryClient.setQueryData(packageKeys.detail(packageId), detail);
      void queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
    },
    onError: (error) => refetchIfReviewClosed(queryClient, packageId, error),
  });
}

// POST /api/packages/:id/decision with the package version the engineer read, the engineer's
// password and any override reason. A newer
// version answers 409 stale_review: the caller shows it and refetches; nothing is retried
// on the engineer's behalf.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Decision } from '@shared/schemas/common';
import { PackageDetail } from '@shared/schemas/packages';
import { api, isApiError } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';
import { packagePath, refetchIfReviewClosed } from '@/lib/findings-client';

export type DecisionInput = {
  decision: Decision;
  conditions: string;
  baseVersion: number;
  /** Required while something stands against Accepted / Accepted as noted; '' otherwise. */
  overrideReason: string;
  /** The engineer's password: the step-up that confirms the decision. */
  password: string;
};

export function recordDecision(packageId: string, body: DecisionInput): Promise<PackageDetail> {
  return api.post(`${packagePath(packageId)}/decision`, body, PackageDetail);
}

export function isStaleReview(error: unknown): boolean {
  return isApiError(error) && error.status === 409 && error.code === 'stale_review';
}

export function useRecordDecision(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: DecisionInput) => recordDecision(packageId, body),
    onSuccess: (detail) => {
      queryClient.setQueryData(packageKeys.detail(packageId), detail);
      void queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
    },
    onError: (error) => {
      if (isStaleReview(error))
        void queryClient.invalidateQueries({ queryKey: packageKeys.detail(packageId), exact: true });
      else refetchIfReviewClosed(queryClient, packageId, error);
    },
  });
}

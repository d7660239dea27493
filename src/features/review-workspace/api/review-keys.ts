// Query keys of the review workspace. They hang under the package's own detail key, so
// invalidating a package (packageKeys.detail) also refreshes its markups, findings and
// revision difference.
import type { QueryClient } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-client';

export const reviewKeys = {
  markups: (packageId: string) => [...packageKeys.detail(packageId), 'markups'] as const,
  findings: (packageId: string) => [...packageKeys.detail(packageId), 'findings'] as const,
  compare: (packageId: string, from: number, to: number) =>
    [...packageKeys.detail(packageId), 'compare', { from, to }] as const,
};

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

// Query keys of the review workspace. They hang under the package's own detail key, so
// invalidating a package (packageKeys.detail) also refreshes its markups, findings and
// revision difference.
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

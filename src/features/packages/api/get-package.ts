// GET /api/packages/:id: one package as its list row, plus its revisions. The server
// answers 404 for a package outside this person's scope.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { PackageSummary } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-client';

// Only the parts this page shows; the rest of the answer is left for the workspace to come.
const PackageDetailResponse = z.object({
  package: PackageSummary,
  revisions: z.array(
    z.object({
      id: z.string(),
      number: z.number().int(),
      state: z.string(),
      submittedAt: z.string().nullable(),
    }),
  ),
});
export type PackageDetailResponse = z.infer<typeof PackageDetailResponse>;

export function getPackage(id: string, signal?: AbortSignal): Promise<PackageDetailResponse> {
  return api.get(`/api/packages/${encodeURIComponent(id)}`, PackageDetailResponse, { signal });
}

export const packageQueryOptions = (id: string) =>
  queryOptions({
    queryKey: packageKeys.detail(id),
    queryFn: ({ signal }) => getPackage(id, signal),
  });

export function usePackage(id: string) {
  return useQuery(packageQueryOptions(id));
}

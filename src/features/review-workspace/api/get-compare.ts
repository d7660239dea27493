// GET /api/packages/:id/compare?from=&to=: the inputs that changed between two revisions
// and every check's status and value in each.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { RevisionCompare } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { packagePath } from '@/lib/findings-client';
import { packageKeys } from '@/lib/query-keys';

export function getCompare(
  packageId: string,
  from: number,
  to: number,
  signal?: AbortSignal,
): Promise<RevisionCompare> {
  return api.get(`${packagePath(packageId)}/compare`, RevisionCompare, { signal, query: { from, to } });
}

export const compareQueryOptions = (packageId: string, from: number, to: number) =>
  queryOptions({
    queryKey: packageKeys.compare(packageId, from, to),
    queryFn: ({ signal }) => getCompare(packageId, from, to, signal),
  });

export function useCompare(packageId: string, from: number, to: number, enabled: boolean) {
  return useQuery({ ...compareQueryOptions(packageId, from, to), enabled });
}

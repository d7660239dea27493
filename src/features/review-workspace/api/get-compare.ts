// GET /api/packages/:id/compare?from=&to=: the inputs that changed between two revisions
// and every check's status and value in each.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { packagePath, reviewKeys } from './review-keys';

const Side = z.object({ status: z.string(), value: z.number().nullable() }).nullable();

export const RevisionCompare = z.object({
  from: z.number().int(),
  to: z.number().int(),
  inputs: z.array(z.object({ path: z.string(), from: z.unknown(), to: z.unknown() })),
  checks: z.array(
    z.object({
      id: z.string(),
      label: z.string(),
      unit: z.string(),
      from: Side,
      to: Side,
      changed: z.boolean(),
    }),
  ),
});
export type RevisionCompare = z.infer<typeof RevisionCompare>;

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
    queryKey: reviewKeys.compare(packageId, from, to),
    queryFn: ({ signal }) => getCompare(packageId, from, to, signal),
  });

export function useCompare(packageId: string, from: number, to: number, enabled: boolean) {
  return useQuery({ ...compareQueryOptions(packageId, from, to), enabled });
}

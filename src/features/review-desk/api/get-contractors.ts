// GET /api/admin/organisations (administrators only): the contractor organisations that
// work on the desk's sites, for the queue's contractor filter.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { OrganisationList } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { organisationKeys } from '@/lib/query-keys';

export type Contractor = { id: string; name: string };

export async function getContractors(signal?: AbortSignal): Promise<Contractor[]> {
  const list = await api.get('/api/admin/organisations', OrganisationList, { signal });
  return list.items.filter((o) => o.kind === 'contractor').map(({ id, name }) => ({ id, name }));
}

export const contractorsQueryOptions = () =>
  queryOptions({
    queryKey: organisationKeys.all,
    queryFn: ({ signal }) => getContractors(signal),
    staleTime: 5 * 60_000,
  });

export function useContractors({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...contractorsQueryOptions(), enabled });
}

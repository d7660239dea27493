// GET /api/engineers: the engineers of record a coordinator may assign, with how many
// packages each has open (coordinators and administrators only).
import { queryOptions, useQuery } from '@tanstack/react-query';
import { EngineerList } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { engineerKeys } from '@/lib/query-keys';

export function getEngineers(signal?: AbortSignal): Promise<EngineerList> {
  return api.get('/api/engineers', EngineerList, { signal });
}

export const engineersQueryOptions = () =>
  queryOptions({
    queryKey: engineerKeys.all,
    queryFn: ({ signal }) => getEngineers(signal),
    staleTime: 60_000,
  });

export function useEngineers({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...engineersQueryOptions(), enabled });
}

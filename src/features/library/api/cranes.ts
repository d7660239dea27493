// GET /api/library/cranes (search, capacity at a radius), GET /api/library/cranes/:id, and
// POST /api/library/cranes: the contractor's fleet.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { CraneDetail, CraneList, type CraneBody } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { libraryKeys, type CraneFilters } from '@/lib/query-keys';

export const cranesQueryOptions = (filters: CraneFilters) =>
  queryOptions({
    queryKey: libraryKeys.cranes(filters),
    queryFn: ({ signal }) => api.get('/api/library/cranes', CraneList, { signal, query: filters }),
  });

export const useCranes = (filters: CraneFilters) => useQuery(cranesQueryOptions(filters));

export const craneQueryOptions = (id: string) =>
  queryOptions({
    queryKey: libraryKeys.crane(id),
    queryFn: ({ signal }) =>
      api.get(`/api/library/cranes/${encodeURIComponent(id)}`, CraneDetail, { signal }),
  });

export const useCrane = (id: string) => useQuery(craneQueryOptions(id));

export function useCreateCrane() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CraneBody) => api.post('/api/library/cranes', body, CraneDetail),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.all }),
  });
}

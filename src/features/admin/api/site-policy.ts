// GET/PUT /api/admin/sites/:id/policy: a site's review policy — the overrides the site
// has, the policy the engine will use, the defaults with their sources, and who changed
// what. A PUT replaces the whole set of overrides; a key left out takes its default.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { PolicyResponse } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { adminKeys } from '@/lib/query-keys';

export type { PolicyResponse };
export type PolicyOverrides = Record<string, unknown>;

export function getSitePolicy(siteId: string, signal?: AbortSignal) {
  return api.get(`/api/admin/sites/${encodeURIComponent(siteId)}/policy`, PolicyResponse, { signal });
}

export const sitePolicyQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: adminKeys.policy(siteId),
    queryFn: ({ signal }) => getSitePolicy(siteId, signal),
  });

export function useSitePolicy(siteId: string) {
  return useQuery(sitePolicyQueryOptions(siteId));
}

export function useSaveSitePolicy(siteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (overrides: PolicyOverrides) =>
      api.put(`/api/admin/sites/${encodeURIComponent(siteId)}/policy`, { overrides }, PolicyResponse),
    onSuccess: (data) => {
      queryClient.setQueryData(adminKeys.policy(siteId), data);
      // The sites list shows each site's policy version.
      return queryClient.invalidateQueries({ queryKey: adminKeys.sites(), exact: true });
    },
  });
}

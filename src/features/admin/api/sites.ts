// /api/admin/sites: every site on the desk, creating and editing one, and the lift
// coordinators (reviewers) who receive its packages.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { AdminSite, type SiteBody, type SitePatch } from '@shared/schemas/admin';
import { api, request } from '@/lib/api-client';
import { siteKeys } from '@/lib/query-keys';
import { adminKeys } from '@/lib/query-keys';

export type AdminSite = z.infer<typeof AdminSite>;
const SiteList = z.object({ items: z.array(AdminSite) });

export function getAdminSites(signal?: AbortSignal) {
  return api.get('/api/admin/sites', SiteList, { signal });
}

export const adminSitesQueryOptions = () =>
  queryOptions({ queryKey: adminKeys.sites(), queryFn: ({ signal }) => getAdminSites(signal) });

export function useAdminSites() {
  return useQuery(adminSitesQueryOptions());
}

function useRefreshSites() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: adminKeys.sites() }),
      // The site pickers on the other desks read /api/sites.
      queryClient.invalidateQueries({ queryKey: siteKeys.all }),
    ]);
}

export function useCreateSite() {
  const refresh = useRefreshSites();
  return useMutation({
    mutationFn: (body: z.output<typeof SiteBody>) => api.post('/api/admin/sites', body, AdminSite),
    onSuccess: refresh,
  });
}

export function useUpdateSite() {
  const refresh = useRefreshSites();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: z.output<typeof SitePatch> }) =>
      request(`/api/admin/sites/${encodeURIComponent(id)}`, { method: 'PATCH', body }, AdminSite),
    onSuccess: refresh,
  });
}

export function useSetSiteReviewers() {
  const refresh = useRefreshSites();
  return useMutation({
    mutationFn: ({ id, userIds }: { id: string; userIds: string[] }) =>
      api.put(`/api/admin/sites/${encodeURIComponent(id)}/reviewers`, { userIds }, AdminSite),
    onSuccess: refresh,
  });
}

// GET /api/sites: the sites a contractor may submit lift packages to.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { SiteList } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { siteKeys } from '@/lib/query-keys';

export function getSites(signal?: AbortSignal): Promise<SiteList> {
  return api.get('/api/sites', SiteList, { signal });
}

export const sitesQueryOptions = () =>
  queryOptions({ queryKey: siteKeys.all, queryFn: ({ signal }) => getSites(signal), staleTime: 5 * 60_000 });

export function useSites() {
  return useQuery(sitesQueryOptions());
}

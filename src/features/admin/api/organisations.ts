// GET/POST /api/admin/organisations and PATCH /api/admin/organisations/:id: the
// contractors and site owners on the desk, with how many people each has.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  AdminOrganisation,
  OrganisationList,
  type OrganisationBody,
  type OrganisationPatch,
} from '@shared/schemas/admin';
import { api, request } from '@/lib/api-client';
import { organisationKeys } from '@/lib/query-keys';
import { adminKeys } from '@/lib/query-keys';

export function getOrganisations(signal?: AbortSignal) {
  return api.get('/api/admin/organisations', OrganisationList, { signal });
}

export const organisationsQueryOptions = () =>
  queryOptions({ queryKey: adminKeys.organisations(), queryFn: ({ signal }) => getOrganisations(signal) });

export function useOrganisations() {
  return useQuery(organisationsQueryOptions());
}

function useRefreshOrganisations() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: adminKeys.organisations() }),
      // Other desks list organisations too (the queue's contractor filter).
      queryClient.invalidateQueries({ queryKey: organisationKeys.all }),
    ]);
}

export function useCreateOrganisation() {
  const refresh = useRefreshOrganisations();
  return useMutation({
    mutationFn: (body: z.input<typeof OrganisationBody>) =>
      api.post('/api/admin/organisations', body, AdminOrganisation),
    onSuccess: refresh,
  });
}

export function useRenameOrganisation() {
  const refresh = useRefreshOrganisations();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: z.input<typeof OrganisationPatch> }) =>
      request(
        `/api/admin/organisations/${encodeURIComponent(id)}`,
        { method: 'PATCH', body },
        AdminOrganisation,
      ),
    onSuccess: refresh,
  });
}

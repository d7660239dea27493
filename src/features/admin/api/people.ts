// /api/admin/people: everyone with an account or an invitation, inviting by e-mail,
// changing a role, deactivating (their sessions end; their history stays) and sending a
// fresh invitation link.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { InvitedPerson, Person, type InviteBody, type PersonPatch } from '@shared/schemas/admin';
import { api, request } from '@/lib/api-client';
import { engineerKeys } from '@/lib/query-keys';
import { adminKeys, type PeopleFilters } from '@/lib/query-keys';

export type { InvitedPerson, Person };
const PeopleList = z.object({ items: z.array(Person) });

export function getPeople(filters: PeopleFilters, signal?: AbortSignal) {
  return api.get('/api/admin/people', PeopleList, { signal, query: filters });
}

export const peopleQueryOptions = (filters: PeopleFilters) =>
  queryOptions({
    queryKey: adminKeys.peopleList(filters),
    queryFn: ({ signal }) => getPeople(filters, signal),
  });

export function usePeople(filters: PeopleFilters, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...peopleQueryOptions(filters), enabled });
}

function useRefreshPeople() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: adminKeys.people() }),
      // Counts of people per organisation, reviewers on sites, and the engineer pickers.
      queryClient.invalidateQueries({ queryKey: adminKeys.organisations() }),
      queryClient.invalidateQueries({ queryKey: adminKeys.sites() }),
      queryClient.invalidateQueries({ queryKey: engineerKeys.all }),
    ]);
}

export function useInvitePerson() {
  const refresh = useRefreshPeople();
  return useMutation({
    mutationFn: (body: z.output<typeof InviteBody>) =>
      api.post('/api/admin/people/invite', body, InvitedPerson),
    onSuccess: refresh,
  });
}

export function useUpdatePerson() {
  const refresh = useRefreshPeople();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: z.output<typeof PersonPatch> }) =>
      request(`/api/admin/people/${encodeURIComponent(id)}`, { method: 'PATCH', body }, Person),
    onSuccess: refresh,
  });
}

export function useReinvitePerson() {
  const refresh = useRefreshPeople();
  return useMutation({
    mutationFn: (id: string) =>
      api.post(`/api/admin/people/${encodeURIComponent(id)}/reinvite`, undefined, InvitedPerson),
    onSuccess: refresh,
  });
}

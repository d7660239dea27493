// GET/PATCH /api/me/profile and POST /api/me/password: the signed-in person's own name,
// unit system, reminder choice and password. A change of unit system refreshes /api/me,
// which every page reads its units from, so the whole desk re-renders in the new units.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { Profile, type PasswordChangeBody, type ProfilePatch } from '@shared/schemas/admin';
import { api, request } from '@/lib/api-client';
import { authKeys, profileKeys } from '@/lib/query-keys';

export function getProfile(signal?: AbortSignal) {
  return api.get('/api/me/profile', Profile, { signal });
}

export const profileQueryOptions = () =>
  queryOptions({ queryKey: profileKeys.all, queryFn: ({ signal }) => getProfile(signal) });

export function useProfile() {
  return useQuery(profileQueryOptions());
}

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: z.output<typeof ProfilePatch>) =>
      request('/api/me/profile', { method: 'PATCH', body }, Profile),
    onSuccess: (profile) => {
      queryClient.setQueryData(profileKeys.all, profile);
      // The name in the rail and the units on every page come from /api/me.
      return queryClient.invalidateQueries({ queryKey: authKeys.me() });
    },
  });
}

export function useChangePassword() {
  return useMutation({
    mutationFn: (body: z.output<typeof PasswordChangeBody>) => api.post<void>('/api/me/password', body),
  });
}

// The public invitation link: GET /api/invites/:token says who it is for (404 when the
// link is unknown or used, 410 invite_expired when it ran out); POST sets the password and
// signs the person in (the server sets the session cookie).
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { AcceptInviteBody, InviteInfo } from '@shared/schemas/admin';
import { MeResponse } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { authKeys, inviteKeys } from '@/lib/query-keys';

export function getInvite(token: string, signal?: AbortSignal) {
  return api.get(`/api/invites/${encodeURIComponent(token)}`, InviteInfo, { signal });
}

export const inviteQueryOptions = (token: string) =>
  queryOptions({
    queryKey: inviteKeys.token(token),
    queryFn: ({ signal }) => getInvite(token, signal),
    retry: false,
    refetchOnWindowFocus: false,
  });

export function useInvite(token: string) {
  return useQuery(inviteQueryOptions(token));
}

export function useAcceptInvite(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: z.output<typeof AcceptInviteBody>) =>
      api.post(`/api/invites/${encodeURIComponent(token)}`, body, MeResponse),
    onSuccess: ({ user }) => {
      // Whoever was signed in in this browser before is gone: start clean as the new person.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}

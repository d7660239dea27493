// GET /api/hand-offs and POST /api/hand-offs/read: what the desk handed the signed-in person,
// with the unread count the rail shows.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { HandOffList, HandOffsUnread, type MarkHandOffsRead } from '@shared/schemas/hand-offs';
import { api } from '@/lib/api-client';
import { handOffKeys } from '@/lib/query-keys';

export function useHandOffs() {
  return useQuery({
    queryKey: handOffKeys.all,
    queryFn: ({ signal }) => api.get('/api/hand-offs', HandOffList, { signal }),
    // The live stream says when there is something new; a slow poll covers a lost stream.
    refetchInterval: 5 * 60_000,
  });
}

export function useMarkHandOffsRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MarkHandOffsRead) => api.post('/api/hand-offs/read', body, HandOffsUnread),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: handOffKeys.all }),
  });
}

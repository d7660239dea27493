// The signed-in desk listens to GET /api/live (server-sent events): when someone else changes
// a package this person may see, its page and every list refresh in place; when the desk
// hands this person something, the list of hand-offs refreshes. EventSource reconnects by
// itself; after a reconnect everything is refreshed once, since changes may have been missed.
import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { handOffKeys, packageKeys } from './query-keys';

/** Lists refresh at most this often while a burst of changes arrives. */
const LIST_REFRESH_MS = 400;

export function useLiveUpdates(enabled: boolean) {
  const queryClient = useQueryClient();
  useEffect(() => {
    if (!enabled || typeof EventSource === 'undefined') return;
    const source = new EventSource('/api/live', { withCredentials: true });
    let listTimer: ReturnType<typeof setTimeout> | null = null;
    let opened = false;
    const refreshLists = () => {
      if (listTimer) return;
      listTimer = setTimeout(() => {
        listTimer = null;
        void queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
      }, LIST_REFRESH_MS);
    };
    source.addEventListener('ready', () => {
      if (opened) {
        void queryClient.invalidateQueries({ queryKey: packageKeys.all });
        void queryClient.invalidateQueries({ queryKey: handOffKeys.all });
      }
      opened = true;
    });
    source.addEventListener('package', (event) => {
      const { packageId } = JSON.parse((event as MessageEvent<string>).data) as { packageId?: string };
      if (packageId) void queryClient.invalidateQueries({ queryKey: packageKeys.detail(packageId) });
      refreshLists();
    });
    source.addEventListener('handoff', () => {
      void queryClient.invalidateQueries({ queryKey: handOffKeys.all });
    });
    return () => {
      if (listTimer) clearTimeout(listTimer);
      source.close();
    };
  }, [enabled, queryClient]);
}

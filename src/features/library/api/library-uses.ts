// A package's use of the library: GET/PUT /api/packages/:id/library-uses, DELETE …/:slot.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { LibraryUseList } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { libraryKeys } from '@/lib/query-keys';

const base = (packageId: string) => `/api/packages/${encodeURIComponent(packageId)}/library-uses`;

export const libraryUsesQueryOptions = (packageId: string) =>
  queryOptions({
    queryKey: libraryKeys.uses(packageId),
    queryFn: ({ signal }) => api.get(base(packageId), LibraryUseList, { signal }),
  });

export const useLibraryUses = (packageId: string) => useQuery(libraryUsesQueryOptions(packageId));

export function useSetLibraryUse(packageId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { versionId: string; slot?: number; detached?: boolean }) =>
      api.put(base(packageId), body, LibraryUseList),
    onSuccess: (data) => qc.setQueryData(libraryKeys.uses(packageId), data),
  });
}

export function useRemoveLibraryUse(packageId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (slot: number) => api.delete(`${base(packageId)}/${slot}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.uses(packageId) }),
  });
}

/**
 * A crane of a lift with several cranes was removed from the editor (`slot` 1 to 3), or the lift
 * went back to one crane (`slot` null: every other crane). The cranes after it move up one place in
 * the lift input, so their library uses move up one slot with them; nothing else changes.
 */
export function useCraneRemoved(packageId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (slot: number | null) => {
      const now = await api.get(base(packageId), LibraryUseList);
      const others = now.items.filter((u) => u.slot > 0).sort((a, b) => a.slot - b.slot);
      for (const u of others) {
        if (slot === null || u.slot === slot) await api.delete(`${base(packageId)}/${u.slot}`);
        else if (u.slot > slot) {
          await api.put(base(packageId), { versionId: u.version.id, slot: u.slot - 1, detached: u.detached });
          await api.delete(`${base(packageId)}/${u.slot}`);
        }
      }
    },
    onSettled: () => qc.invalidateQueries({ queryKey: libraryKeys.uses(packageId) }),
  });
}

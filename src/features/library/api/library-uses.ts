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
 * the lift input, so the server moves their library uses up one slot with them, in one transaction.
 */
export function useCraneRemoved(packageId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (slot: number | null) =>
      api.post(`${base(packageId)}/crane-removed`, { slot }, LibraryUseList),
    onSuccess: (data) => qc.setQueryData(libraryKeys.uses(packageId), data),
    onError: () => qc.invalidateQueries({ queryKey: libraryKeys.uses(packageId) }),
  });
}

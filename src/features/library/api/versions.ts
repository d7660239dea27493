// One version (GET /api/library/versions/:id), retiring it, the owner desk's verification,
// and the links for its document and chart files.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { VersionDetail } from '@shared/schemas/library';
import { api, apiErrorFrom, CSRF_HEADER } from '@/lib/api-client';
import { libraryKeys } from '@/lib/query-keys';

const base = (id: string) => `/api/library/versions/${encodeURIComponent(id)}`;

export const versionQueryOptions = (id: string) =>
  queryOptions({
    queryKey: libraryKeys.version(id),
    queryFn: ({ signal }) => api.get(base(id), VersionDetail, { signal }),
  });

export const useVersion = (id: string | undefined) =>
  useQuery({ ...versionQueryOptions(id ?? ''), enabled: !!id });

export const chartFileUrl = (id: string, format: 'csv' | 'xlsx') => `${base(id)}/chart?format=${format}`;
export const documentUrl = (id: string) => `${base(id)}/document`;

export function useRetireVersion() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post(`${base(id)}/retire`, undefined, VersionDetail),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.all }),
  });
}

export function useVerifyVersion() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id: string; note: string; packageId?: string }) =>
      api.post(`${base(v.id)}/verifications`, { note: v.note, packageId: v.packageId }, VersionDetail),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.all }),
  });
}

/** POST /api/library/versions/:id/document: the manufacturer's PDF, once per version. */
export function useAttachDocument() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, file }: { id: string; file: File }) => {
      const form = new FormData();
      form.append('file', file, file.name);
      let res: Response;
      try {
        res = await fetch(`${base(id)}/document`, {
          method: 'POST',
          body: form,
          credentials: 'include',
          headers: CSRF_HEADER,
        });
      } catch {
        throw apiErrorFrom(0, '');
      }
      if (!res.ok) throw apiErrorFrom(res.status, await res.text());
      return VersionDetail.parse(await res.json());
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.all }),
  });
}

// A configuration's history (GET /api/library/configurations/:id), a new configuration
// (POST …/cranes/:id/configurations) and an edit, which is a new version (POST …/versions).
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ConfigurationBody, ConfigurationDetail, VersionBody, VersionDetail } from '@shared/schemas/library';
import { api } from '@/lib/api-client';
import { libraryKeys } from '@/lib/query-keys';

export const configurationQueryOptions = (id: string) =>
  queryOptions({
    queryKey: libraryKeys.configuration(id),
    queryFn: ({ signal }) =>
      api.get(`/api/library/configurations/${encodeURIComponent(id)}`, ConfigurationDetail, { signal }),
  });

export const useConfiguration = (id: string) => useQuery(configurationQueryOptions(id));

export function useCreateConfiguration(craneId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: z.input<typeof ConfigurationBody>) =>
      api.post(
        `/api/library/cranes/${encodeURIComponent(craneId)}/configurations`,
        body,
        ConfigurationDetail,
      ),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.all }),
  });
}

export function useAddVersion(configurationId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: z.input<typeof VersionBody>) =>
      api.post(
        `/api/library/configurations/${encodeURIComponent(configurationId)}/versions`,
        body,
        VersionDetail,
      ),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.all }),
  });
}

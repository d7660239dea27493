// GET /api/packages/:id/check-run: where the current revision's check job is (waiting for
// the job queue, queued, running), polled while it is under way; and
// POST /api/packages/:id/check-run/retry: run a check that could not run again
// (contractor or reviewer; 409 when it has not failed).
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { CheckRunStatus } from '@shared/schemas/check-runs';
import { PackageDetail } from '@shared/schemas/packages';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';

export const CHECK_RUN_POLL_MS = 2000;

/** Under the package's detail key, so refreshing the package refreshes this too. */
export const checkRunKey = (id: string) => [...packageKeys.detail(id), 'check-run'] as const;

export function getCheckRun(id: string, signal?: AbortSignal): Promise<CheckRunStatus> {
  return api.get(`/api/packages/${encodeURIComponent(id)}/check-run`, CheckRunStatus, { signal });
}

export const checkRunQueryOptions = (id: string) =>
  queryOptions({
    queryKey: checkRunKey(id),
    queryFn: ({ signal }) => getCheckRun(id, signal),
    refetchInterval: (query) => {
      const status = query.state.data?.status;
      return status === 'queued' || status === 'running' ? CHECK_RUN_POLL_MS : false;
    },
  });

export function useCheckRun(id: string, enabled: boolean) {
  return useQuery({ ...checkRunQueryOptions(id), enabled });
}

export function retryCheck(id: string): Promise<PackageDetail> {
  return api.post(`/api/packages/${encodeURIComponent(id)}/check-run/retry`, undefined, PackageDetail);
}

export function useRetryCheck(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => retryCheck(id),
    onSuccess: (detail) => {
      queryClient.setQueryData(packageKeys.detail(id), detail);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: checkRunKey(id) }),
        queryClient.invalidateQueries({ queryKey: packageKeys.lists() }),
      ]);
    },
  });
}

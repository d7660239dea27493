// GET /api/health: whether the database and the job queue answer. The server answers 503
// with the same body when either is down, so a 503 is read as a report, not a failure.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { HealthResponse } from '@shared/schemas/health';
import { healthKeys } from '@/lib/query-keys';

export async function getHealth(signal?: AbortSignal): Promise<HealthResponse> {
  const response = await fetch('/api/health', {
    credentials: 'include',
    signal,
    headers: { Accept: 'application/json' },
  });
  const body: unknown = await response.json().catch(() => null);
  const parsed = HealthResponse.safeParse(body);
  if (parsed.success) return parsed.data;
  throw new Error(`The health check answered ${response.status} without a report.`);
}

export const healthQueryOptions = () =>
  queryOptions({
    queryKey: healthKeys.all,
    queryFn: ({ signal }) => getHealth(signal),
    refetchInterval: 60_000,
  });

export function useHealth() {
  return useQuery(healthQueryOptions());
}

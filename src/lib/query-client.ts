// The TanStack Query client: cache defaults and the 401 handling. The key factories are in
// query-keys.ts.
import { QueryCache, QueryClient, type QueryClientConfig } from '@tanstack/react-query';
import { isApiError } from './api-client';
import { authKeys } from './query-keys';

export function createQueryClient(config: QueryClientConfig = {}): QueryClient {
  const client: QueryClient = new QueryClient({
    ...config,
    // A 401 on any query means the session cookie has expired: forget the user, and the
    // route guard sends the person to the sign-in page with the page they were on.
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isApiError(error) && error.status === 401 && query.queryKey[0] !== authKeys.all[0]) {
          client.setQueryData(authKeys.me(), null);
        }
      },
    }),
    defaultOptions: {
      ...config.defaultOptions,
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: true,
        retry: (failureCount, error) => {
          if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
          return failureCount < 2;
        },
        ...config.defaultOptions?.queries,
      },
    },
  });
  return client;
}

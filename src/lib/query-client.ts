// The TanStack Query client and the query-key factories. Keys run from general to
// specific and include every input, so invalidating `packageKeys.all` reaches every list.
import { QueryCache, QueryClient, type QueryClientConfig } from '@tanstack/react-query';
import type { PackageListQuery } from '@shared/schemas/packages';
import { isApiError } from './api-client';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

/** Every input of a package list request; the whole object is part of the query key. */
export type PackageListFilters = Pick<
  PackageListQuery,
  | 'status'
  | 'siteId'
  | 'contractorId'
  | 'engineerId'
  | 'critical'
  | 'discrepancies'
  | 'liftWithinDays'
  | 'revisionMin'
  | 'q'
  | 'sort'
  | 'page'
  | 'pageSize'
>;

export const packageKeys = {
  all: ['packages'] as const,
  lists: () => [...packageKeys.all, 'list'] as const,
  list: (filters: PackageListFilters) => [...packageKeys.lists(), filters] as const,
  details: () => [...packageKeys.all, 'detail'] as const,
  detail: (id: string) => [...packageKeys.details(), id] as const,
  /** Under the package's detail key, so refreshing a package refreshes these too. */
  returns: (id: string) => [...packageKeys.detail(id), 'returns'] as const,
  findings: (id: string) => [...packageKeys.detail(id), 'findings'] as const,
};

export const engineerKeys = {
  all: ['engineers'] as const,
};

export const organisationKeys = {
  all: ['organisations'] as const,
};

export const verifyKeys = {
  all: ['verify'] as const,
  code: (code: string) => [...verifyKeys.all, code] as const,
};

export const siteKeys = {
  all: ['sites'] as const,
};

export const healthKeys = {
  all: ['health'] as const,
};

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

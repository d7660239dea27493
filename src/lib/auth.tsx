// Who is signed in, and the guards that keep pages to the people allowed on them.
// The session lives in an httpOnly cookie the server sets; the client never sees a token.
// The current user is ordinary server data in TanStack Query: null means "not signed in".
import type { ReactNode } from 'react';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { Navigate, useLocation } from 'react-router-dom';
import { MeResponse, type CurrentUser, type SignInBody } from '@shared/schemas/auth';
import type { Role } from '@shared/schemas/common';
import { api, isApiError } from './api-client';
import { authKeys } from './query-keys';
import { ROLE_HOME } from './roles';
import { PageLoading } from '@/components/ui/page-loading';

export async function getMe(): Promise<CurrentUser | null> {
  try {
    const { user } = await api.get('/api/me', MeResponse);
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: getMe,
    staleTime: 5 * 60_000,
    retry: false,
  });

export function useCurrentUser() {
  return useQuery(meQueryOptions());
}

export function signIn(body: SignInBody): Promise<MeResponse> {
  return api.post('/api/auth/sign-in', body, MeResponse);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => {
      // Drop anything cached for a previous person before the new one sees a page.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}

export function signOut(): Promise<void> {
  return api.post<void>('/api/auth/sign-out');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      queryClient.clear();
      queryClient.setQueryData(authKeys.me(), null);
    },
  });
}

export function homeFor(user: Pick<CurrentUser, 'role'>): string {
  return ROLE_HOME[user.role];
}

/** Accepts only a same-site path for ?next=, so a crafted link cannot send people elsewhere. */
export function safeNextPath(next: string | null): string | null {
  if (!next) return null;
  let decoded = next;
  try {
    decoded = decodeURIComponent(next);
  } catch {
    return null;
  }
  for (const form of [next, decoded]) {
    // Browsers drop tabs and newlines inside URLs ("/\t/evil" becomes "//evil") and read a
    // backslash as a slash, so any control character or whitespace is refused outright.
    // eslint-disable-next-line no-control-regex -- control characters are exactly what is refused
    if (/[\u0000-\u001f\u007f\s]/.test(form)) return null;
    if (!form.startsWith('/') || form.startsWith('//') || form.startsWith('/\\')) return null;
  }
  // Resolved against a placeholder origin, a same-origin path keeps that origin.
  const base = 'http://desk.invalid';
  const url = new URL(next, base);
  if (url.origin !== base) return null;
  const path = `${url.pathname}${url.search}${url.hash}`;
  if (path.startsWith('/sign-in')) return null;
  return path;
}

export function signInPathFor(location: { pathname: string; search: string; hash?: string }): string {
  const next = `${location.pathname}${location.search}${location.hash ?? ''}`;
  return next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`;
}

/** Renders its children only for a signed-in person; anyone else goes to /sign-in?next=… */
export function RequireAuth({ children }: { children: ReactNode }) {
  const location = useLocation();
  const me = useCurrentUser();
  if (me.isPending) return <PageLoading label="Checking your session" />;
  if (me.isError) throw me.error;
  if (!me.data) return <Navigate to={signInPathFor(location)} replace />;
  return <>{children}</>;
}

/** Inside RequireAuth: a person whose role may not open the page is sent to their own home. */
export function RequireRole({ roles, children }: { roles: readonly Role[]; children: ReactNode }) {
  const me = useCurrentUser();
  if (!me.data) return null;
  if (!roles.includes(me.data.role)) return <Navigate to={homeFor(me.data)} replace />;
  return <>{children}</>;
}

// GET /api/verify/:code (public, no sign-in): what a stamped return's code stands for —
// the package, revision, decision, dates, the file's sha-256 and whether a later
// revision supersedes it. Unknown codes answer 404; too many look-ups answer 429.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { Verification } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { verifyKeys } from '@/lib/query-keys';

/** Codes are printed in groups and read aloud: keep only letters and digits, in capitals. */
export function normaliseCode(raw: string): string {
  return raw.replace(/[^a-z0-9]/gi, '').toUpperCase();
}

export function getVerification(code: string, signal?: AbortSignal): Promise<Verification> {
  return api.get(`/api/verify/${encodeURIComponent(code)}`, Verification, { signal });
}

export const verificationQueryOptions = (code: string) =>
  queryOptions({
    queryKey: verifyKeys.code(code),
    queryFn: ({ signal }) => getVerification(code, signal),
    // The answer can change (a later revision supersedes this one): never trust an old copy.
    staleTime: 0,
    refetchOnWindowFocus: true,
  });

export function useVerification(code: string) {
  return useQuery({ ...verificationQueryOptions(code), enabled: code.length > 0 });
}

// The mail outbox: GET /api/admin/mail (every message the desk queued, with its status
// and last error), GET /api/admin/mail/caught (what the local demo SMTP server received)
// and POST /api/admin/mail/:id/retry for a message that finally failed.
import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { CaughtMail, MailMessage } from '@shared/schemas/admin';
import { api, apiErrorFrom, CSRF_HEADER } from '@/lib/api-client';
import { adminKeys, type MailFilters } from '@/lib/query-keys';

export type MailMessage = z.infer<typeof MailMessage>;
export type CaughtMail = z.infer<typeof CaughtMail>;
const MailList = z.object({ items: z.array(MailMessage), total: z.number().int() });
const CaughtList = z.object({ items: z.array(CaughtMail) });

export function getMail(filters: MailFilters, signal?: AbortSignal) {
  return api.get('/api/admin/mail', MailList, { signal, query: filters });
}

export const mailQueryOptions = (filters: MailFilters) =>
  queryOptions({
    queryKey: adminKeys.mailList(filters),
    queryFn: ({ signal }) => getMail(filters, signal),
    placeholderData: keepPreviousData,
    // Queued messages turn into sent or failed within seconds: keep the list current.
    refetchInterval: 15_000,
  });

export function useMail(filters: MailFilters) {
  return useQuery(mailQueryOptions(filters));
}

export function getCaughtMail(signal?: AbortSignal) {
  return api.get('/api/admin/mail/caught', CaughtList, { signal });
}

export const caughtMailQueryOptions = () =>
  queryOptions({
    queryKey: adminKeys.caught(),
    queryFn: ({ signal }) => getCaughtMail(signal),
    refetchInterval: 15_000,
  });

export function useCaughtMail({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...caughtMailQueryOptions(), enabled });
}

/** 202 Accepted: the message is queued again. The answer may have no body, so no JSON parse. */
export async function retryMail(id: string): Promise<void> {
  let response: Response;
  try {
    response = await fetch(`/api/admin/mail/${encodeURIComponent(id)}/retry`, {
      method: 'POST',
      headers: { Accept: 'application/json', ...CSRF_HEADER },
      credentials: 'include',
    });
  } catch {
    throw apiErrorFrom(0, '');
  }
  if (!response.ok) throw apiErrorFrom(response.status, await response.text());
}

export function useRetryMail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retryMail,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.mail() }),
  });
}

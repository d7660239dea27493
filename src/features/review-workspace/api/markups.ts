// GET /api/packages/:id/markups (the current revision's markups, in PDF page coordinates),
// POST a new one (201 with the stored markup; pins come back numbered) and DELETE one.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { Markup, type MarkupBody } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { packagePath, refetchIfReviewClosed } from '@/lib/findings-client';
import { packageKeys } from '@/lib/query-keys';

const MarkupList = z.object({ items: z.array(Markup) });

export function getMarkups(packageId: string, signal?: AbortSignal): Promise<Markup[]> {
  return api.get(`${packagePath(packageId)}/markups`, MarkupList, { signal }).then((list) => list.items);
}

export const markupsQueryOptions = (packageId: string) =>
  queryOptions({
    queryKey: packageKeys.markups(packageId),
    queryFn: ({ signal }) => getMarkups(packageId, signal),
  });

export function useMarkups(packageId: string) {
  return useQuery(markupsQueryOptions(packageId));
}

/** What a tool produces; the colour's default is filled in by the form, not the server. */
export type MarkupDraft = MarkupBody;

export function createMarkup(packageId: string, body: MarkupDraft): Promise<Markup> {
  return api.post(`${packagePath(packageId)}/markups`, body, Markup);
}

export function useCreateMarkup(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MarkupDraft) => createMarkup(packageId, body),
    onSuccess: (saved) => {
      queryClient.setQueryData<Markup[]>(packageKeys.markups(packageId), (list) => [...(list ?? []), saved]);
    },
    onError: (error) => refetchIfReviewClosed(queryClient, packageId, error),
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: packageKeys.stampPlacement(packageId) });
      return queryClient.invalidateQueries({ queryKey: packageKeys.markups(packageId) });
    },
  });
}

export function deleteMarkup(packageId: string, markupId: string): Promise<void> {
  return api.delete(`${packagePath(packageId)}/markups/${encodeURIComponent(markupId)}`);
}

export function useDeleteMarkup(packageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (markupId: string) => deleteMarkup(packageId, markupId),
    onSuccess: (_nothing, markupId) => {
      queryClient.setQueryData<Markup[]>(packageKeys.markups(packageId), (list) =>
        (list ?? []).filter((m) => m.id !== markupId),
      );
    },
    onError: (error) => refetchIfReviewClosed(queryClient, packageId, error),
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: packageKeys.stampPlacement(packageId) });
      return queryClient.invalidateQueries({ queryKey: packageKeys.markups(packageId) });
    },
  });
}

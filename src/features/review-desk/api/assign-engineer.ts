// POST /api/assignments: assign (or reassign) one engineer of record to one or more
// packages. All or nothing: the server refuses the whole request if one package cannot
// take an engineer.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AssignResult } from '@shared/schemas/reviews';
import { api, isApiError } from '@/lib/api-client';
import { engineerKeys, packageKeys } from '@/lib/query-keys';

export type AssignInput = { packageIds: string[]; engineerId: string; note?: string };

export function assignEngineer(input: AssignInput): Promise<AssignResult> {
  return api.post('/api/assignments', input, AssignResult);
}

export function useAssignEngineer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: assignEngineer,
    onSettled: async (_data, _error, input) => {
      // Even a refusal may mean the list is out of date (a package moved on): refresh it.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: packageKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: engineerKeys.all }),
        ...input.packageIds.map((id) => queryClient.invalidateQueries({ queryKey: packageKeys.detail(id) })),
      ]);
    },
  });
}

const UUID_IN_TEXT = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i;

/** What went wrong with an assignment, in words a coordinator can act on. */
export function explainAssignError(error: unknown, referenceOf: (id: string) => string | undefined): string {
  if (!isApiError(error)) return 'The engineer could not be assigned. Try again.';
  if (error.status === 409 && error.code === 'not_assignable') {
    return `Nothing was assigned. ${error.message} Untick those packages and assign the rest.`;
  }
  if (error.status === 404) {
    const id = UUID_IN_TEXT.exec(error.message)?.[0];
    const which = (id && referenceOf(id)) ?? 'One of the selected packages';
    return `Nothing was assigned. ${which} is no longer in your queue — it may have been withdrawn or moved to a site you do not cover. The list has been refreshed; check the selection and try again.`;
  }
  if (error.status === 400 && error.fields.some((f) => f.path === 'engineerId')) {
    return 'Nothing was assigned. That engineer is no longer an active engineer of your organisation; pick another.';
  }
  if (error.status === 403) return 'Only a lift coordinator assigns engineers of record.';
  return `Nothing was assigned. ${error.message}`;
}

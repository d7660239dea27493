// GET /api/packages/:id/assignments: the package's engineers of record over time.
import { useQuery } from '@tanstack/react-query';
import { AssignmentHistory } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { packageKeys } from '@/lib/query-keys';

export function useAssignmentHistory(packageId: string) {
  return useQuery({
    queryKey: packageKeys.assignments(packageId),
    queryFn: ({ signal }) => api.get(`/api/packages/${packageId}/assignments`, AssignmentHistory, { signal }),
  });
}

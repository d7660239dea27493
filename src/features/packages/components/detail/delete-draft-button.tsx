// A package never submitted can be deleted by its contractor: a confirmation says what goes
// (the draft and its documents) and that it cannot be undone; then back to the list.
import { useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { api, isApiError } from '@/lib/api-client';
import { plural } from '@/lib/format';
import { packageKeys } from '@/lib/query-keys';

export function DeleteDraftButton({
  pkg,
  documents,
}: {
  pkg: { id: string; reference: string; title: string };
  documents: number;
}) {
  const [confirming, setConfirming] = useState(false);
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const remove = useMutation({
    mutationFn: () => api.delete(`/api/packages/${pkg.id}`),
    onSuccess: async () => {
      queryClient.removeQueries({ queryKey: packageKeys.detail(pkg.id) });
      await queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
      navigate('/packages', { replace: true });
    },
  });
  return (
    <>
      <Button size="sm" variant="quiet" onClick={() => setConfirming(true)}>
        Delete draft…
      </Button>
      {confirming && (
        <Dialog
          title={`Delete ${pkg.reference}?`}
          description={`“${pkg.title}” has never been submitted. Deleting it removes the draft and ${plural(documents, 'document')}; it cannot be undone.`}
          onClose={() => setConfirming(false)}
        >
          {remove.isError && (
            <p role="alert" className="mb-3 text-[13px] font-bold text-fail-ink">
              {isApiError(remove.error) ? remove.error.message : 'The draft could not be deleted. Try again.'}
            </p>
          )}
          <div className="flex justify-end gap-2">
            <Button size="sm" variant="quiet" onClick={() => setConfirming(false)}>
              Keep the draft
            </Button>
            <Button size="sm" variant="primary" disabled={remove.isPending} onClick={() => remove.mutate()}>
              {remove.isPending ? 'Deleting…' : `Delete ${pkg.reference}`}
            </Button>
          </div>
        </Dialog>
      )}
    </>
  );
}

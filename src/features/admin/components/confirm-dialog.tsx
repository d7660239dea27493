// Asking before something that cannot be undone lightly (deactivating a person).
import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/page-loading';

export function ConfirmDialog({
  title,
  children,
  confirmLabel,
  pendingLabel,
  pending,
  error,
  onConfirm,
  onClose,
}: {
  title: string;
  children: ReactNode;
  confirmLabel: string;
  pendingLabel: string;
  pending: boolean;
  error?: string | null;
  onConfirm: () => void;
  onClose: () => void;
}) {
  return (
    <Dialog title={title} onClose={onClose} width="max-w-[460px]">
      <div className="flex flex-col gap-3 text-sm leading-relaxed">
        {error && <FormAlert>{error}</FormAlert>}
        {children}
        <div className="mt-1 flex justify-end gap-2 border-t border-rule pt-3">
          <Button onClick={onClose}>Cancel</Button>
          <Button
            variant="primary"
            disabled={pending}
            onClick={onConfirm}
            className="border-failed-ink bg-failed-ink hover:border-fail-ink hover:bg-[#7c1515]"
          >
            {pending && <Spinner />}
            {pending ? pendingLabel : confirmLabel}
          </Button>
        </div>
      </div>
    </Dialog>
  );
}

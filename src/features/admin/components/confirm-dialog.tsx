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
          {/* Red, not the primary green: this button takes something away. */}
          <button
            type="button"
            disabled={pending}
            onClick={onConfirm}
            className="inline-flex h-9 items-center justify-center gap-1.5 whitespace-nowrap rounded-[3px] border border-failed-ink bg-failed-ink px-3.5 text-sm font-bold text-white hover:bg-[#7c1515] disabled:cursor-not-allowed disabled:opacity-70"
          >
            {pending && <Spinner />}
            {pending ? pendingLabel : confirmLabel}
          </button>
        </div>
      </div>
    </Dialog>
  );
}

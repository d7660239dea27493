// A modal dialog: a titled sheet over the page, on Radix's dialog primitive (focus trap,
// Escape, aria-modal, the rest of the page inert) with our own sheet and header. Focus starts
// on the first field rather than the close button, and goes back to where it was on close.
// A click beside the sheet does not close it: a half-filled form should not vanish by a slip.
import { useRef, type ReactNode } from 'react';
import * as RadixDialog from '@radix-ui/react-dialog';

export function Dialog({
  title,
  description,
  onClose,
  children,
  width = 'max-w-[520px]',
}: {
  title: string;
  description?: ReactNode;
  onClose: () => void;
  children: ReactNode;
  width?: string;
}) {
  // Callers open the dialog by rendering it, so there is no Radix trigger to return focus to.
  const before = useRef<HTMLElement | null>(
    typeof document === 'undefined' ? null : (document.activeElement as HTMLElement | null),
  );

  return (
    <RadixDialog.Root open onOpenChange={(open) => !open && onClose()}>
      <RadixDialog.Portal>
        <RadixDialog.Overlay className="fixed inset-0 z-40 flex items-start justify-center overflow-y-auto bg-graphite/55 px-4 py-[8vh]">
          <RadixDialog.Content
            // Without a description Radix would point aria-describedby at nothing.
            {...(description ? {} : { 'aria-describedby': undefined })}
            onOpenAutoFocus={(event) => {
              const node = event.currentTarget as HTMLElement;
              const first = node.querySelector<HTMLElement>(
                'input:not([disabled]), select:not([disabled]), textarea:not([disabled]), button:not([data-close]):not([disabled])',
              );
              event.preventDefault();
              (first ?? node).focus();
            }}
            onCloseAutoFocus={(event) => {
              event.preventDefault();
              if (before.current?.isConnected) before.current.focus();
            }}
            onPointerDownOutside={(event) => event.preventDefault()}
            onInteractOutside={(event) => event.preventDefault()}
            className={`w-full ${width} border border-rule border-t-4 border-t-ink bg-sheet shadow-[0_18px_48px_-20px_rgba(22,25,28,0.6)] focus:outline-none`}
          >
            <div className="flex items-start justify-between gap-3 border-b border-rule px-5 py-3">
              <div>
                <RadixDialog.Title className="text-[17px] font-black leading-tight">
                  {title}
                </RadixDialog.Title>
                {description && (
                  <RadixDialog.Description asChild>
                    <div className="mt-1 text-[13.5px] text-ink-soft">{description}</div>
                  </RadixDialog.Description>
                )}
              </div>
              <RadixDialog.Close
                data-close
                aria-label="Close"
                className="-mr-1 flex size-8 items-center justify-center rounded-[3px] text-ink-soft hover:bg-sheet-alt hover:text-ink"
              >
                <svg className="size-4" viewBox="0 0 16 16" aria-hidden="true" fill="none">
                  <path d="M3.5 3.5 L12.5 12.5 M12.5 3.5 L3.5 12.5" stroke="currentColor" strokeWidth="1.8" />
                </svg>
              </RadixDialog.Close>
            </div>
            <div className="px-5 py-4">{children}</div>
          </RadixDialog.Content>
        </RadixDialog.Overlay>
      </RadixDialog.Portal>
    </RadixDialog.Root>
  );
}

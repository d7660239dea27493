// A modal dialog: a titled sheet over the page. Escape or the close button dismisses it,
// focus moves into it on open and back to where it was on close, and Tab stays inside.
import { useEffect, useId, useRef, type ReactNode } from 'react';

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
  const titleId = useId();
  const descriptionId = useId();
  const sheet = useRef<HTMLDivElement>(null);
  const closeRef = useRef(onClose);

  useEffect(() => {
    closeRef.current = onClose;
  }, [onClose]);

  useEffect(() => {
    const before = document.activeElement as HTMLElement | null;
    const node = sheet.current;
    const first = node?.querySelector<HTMLElement>('input, select, textarea, button:not([data-close])');
    (first ?? node)?.focus();
    return () => before?.focus?.();
  }, []);

  const onKeyDown = (event: React.KeyboardEvent<HTMLDivElement>) => {
    if (event.key === 'Escape') {
      event.stopPropagation();
      closeRef.current();
      return;
    }
    if (event.key !== 'Tab' || !sheet.current) return;
    const focusable = [
      ...sheet.current.querySelectorAll<HTMLElement>(
        'a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled])',
      ),
    ];
    if (focusable.length === 0) return;
    const first = focusable[0]!;
    const last = focusable[focusable.length - 1]!;
    if (event.shiftKey && document.activeElement === first) {
      event.preventDefault();
      last.focus();
    } else if (!event.shiftKey && document.activeElement === last) {
      event.preventDefault();
      first.focus();
    }
  };

  return (
    <div className="fixed inset-0 z-40 flex items-start justify-center overflow-y-auto bg-graphite/55 px-4 py-[8vh]">
      <div
        ref={sheet}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        aria-describedby={description ? descriptionId : undefined}
        tabIndex={-1}
        onKeyDown={onKeyDown}
        className={`w-full ${width} border border-rule border-t-4 border-t-ink bg-sheet shadow-[0_18px_48px_-20px_rgba(22,25,28,0.6)] focus:outline-none`}
      >
        <div className="flex items-start justify-between gap-3 border-b border-rule px-5 py-3">
          <div>
            <h2 id={titleId} className="text-[17px] font-black leading-tight">
              {title}
            </h2>
            {description && (
              <div id={descriptionId} className="mt-1 text-[13.5px] text-ink-soft">
                {description}
              </div>
            )}
          </div>
          <button
            type="button"
            data-close
            onClick={() => closeRef.current()}
            aria-label="Close"
            className="-mr-1 flex size-8 items-center justify-center rounded-[3px] text-ink-soft hover:bg-sheet-alt hover:text-ink"
          >
            <svg className="size-4" viewBox="0 0 16 16" aria-hidden="true" fill="none">
              <path d="M3.5 3.5 L12.5 12.5 M12.5 3.5 L3.5 12.5" stroke="currentColor" strokeWidth="1.8" />
            </svg>
          </button>
        </div>
        <div className="px-5 py-4">{children}</div>
      </div>
    </div>
  );
}

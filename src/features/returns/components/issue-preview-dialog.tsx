// "Issue stamped return" first shows page 1 of the return as it will print (the stamp block, the
// markups, the footer), made by the same builder as the return itself and drawn with pdf.js; the
// coordinator issues it from here once it is shown. The preview is not stored or signed.
import { useEffect, useState } from 'react';
import { DECISION_LABELS, type Decision } from '@shared/schemas/common';
import { renderFirstPage } from '@/lib/pdf-first-page';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Spinner } from '@/components/ui/page-loading';

const PREVIEW_WIDTH = 560;

export function IssuePreviewDialog({
  packageId,
  decision,
  onIssue,
  onClose,
}: {
  packageId: string;
  decision: Decision | null;
  onIssue: () => void;
  onClose: () => void;
}) {
  // A callback ref: the dialog's content mounts in a portal, after this component's first effect.
  const [canvas, setCanvas] = useState<HTMLCanvasElement | null>(null);
  const [state, setState] = useState<{ shown: boolean; error: string | null }>({ shown: false, error: null });

  useEffect(() => {
    if (!canvas) return;
    const task = renderFirstPage(`/api/packages/${packageId}/returns/preview`, canvas, PREVIEW_WIDTH);
    let live = true;
    task.promise.then(
      () => live && setState({ shown: true, error: null }),
      (error: unknown) =>
        live &&
        setState({
          shown: false,
          error: error instanceof Error ? error.message : 'The preview could not be shown.',
        }),
    );
    return () => {
      live = false;
      task.cancel();
    };
  }, [packageId, canvas]);

  return (
    <Dialog
      title="Check the stamped return before issuing"
      description={
        <>
          Page 1 as it will print
          {decision ? (
            <>
              {' '}
              for <strong>{DECISION_LABELS[decision]}</strong>
            </>
          ) : null}
          : the stamp block, the markups and the footer. The verification code is filled in when you issue it.
        </>
      }
      onClose={onClose}
      width="max-w-[640px]"
    >
      <div className="flex flex-col gap-3">
        <div
          className="relative flex min-h-[240px] items-start justify-center overflow-auto border border-rule bg-sheet-alt p-2"
          style={{ maxHeight: '62vh' }}
        >
          {!state.shown && !state.error && (
            <p
              role="status"
              className="absolute inset-x-0 top-8 flex items-center justify-center gap-2 text-[13px]"
            >
              <Spinner className="size-4" /> Making the preview from the same builder as the return…
            </p>
          )}
          <canvas
            ref={setCanvas}
            aria-label="Page 1 of the stamped return as it will print"
            className="bg-white shadow"
          />
        </div>
        {state.error && (
          <p role="alert" className="text-[13px] font-bold text-fail-ink">
            {state.error}
          </p>
        )}
        <div className="flex justify-end gap-2 border-t border-rule pt-3">
          <Button onClick={onClose}>Cancel</Button>
          <Button variant="primary" disabled={!state.shown} onClick={onIssue}>
            Issue as shown
          </Button>
        </div>
      </div>
    </Dialog>
  );
}

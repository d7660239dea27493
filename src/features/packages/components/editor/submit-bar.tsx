// Under each step: the way to the previous and next step and the submit, or — once the lift
// has passed the checks here — the confirmation that submitting freezes the revision.
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import { STEPS, type StepId } from '@shared/catalogue/lift-fields';
import type { useSubmitRevision } from '../../hooks/use-submit-revision';

export function SubmitBar({
  index,
  revision,
  submission,
  onGoTo,
  failingChecks,
}: {
  index: number;
  revision: number;
  submission: ReturnType<typeof useSubmitRevision>;
  onGoTo: (step: StepId) => void;
  /** Checks the live check fails: the confirmation names them. */
  failingChecks: string[];
}) {
  return (
    <>
      {submission.message && (
        <p
          role="alert"
          className="mt-3 border-l-4 border-failed-ink bg-failed-tint px-3 py-2 text-[13px] font-bold text-failed-ink"
        >
          {submission.message}
        </p>
      )}
      {submission.confirming ? (
        <div
          role="alertdialog"
          aria-labelledby="confirm-title"
          className="mt-3 border-2 border-ink bg-sheet-alt px-4 py-3"
        >
          <h3 id="confirm-title" className="text-[15px] font-black">
            Submit revision {revision}?
          </h3>
          <p className="mt-1 text-[13px]">
            Submitting freezes this revision: its lift data and files can no longer change. The independent
            check runs and the package goes to the site’s coordinator. Changes after that need a new revision.
          </p>
          {failingChecks.length > 0 && (
            <p className="mt-1 text-[13px] font-bold text-failed-ink">
              The live check fails on: {failingChecks.join('; ')}.
            </p>
          )}
          <div className="mt-2 flex gap-2">
            <Button variant="primary" onClick={() => void submission.confirm()} disabled={submission.pending}>
              {submission.pending && <Spinner />}
              {submission.pending ? 'Submitting…' : `Submit and freeze revision ${revision}`}
            </Button>
            <Button onClick={submission.cancel} disabled={submission.pending}>
              Keep editing
            </Button>
          </div>
        </div>
      ) : (
        <div className="mt-4 flex flex-wrap items-center justify-between gap-2 border-t border-rule pt-3">
          <div className="flex gap-2">
            {index > 0 && (
              <Button onClick={() => onGoTo(STEPS[index - 1].id)}>‹ {STEPS[index - 1].title}</Button>
            )}
            {index < STEPS.length - 1 && (
              <Button onClick={() => onGoTo(STEPS[index + 1].id)}>{STEPS[index + 1].title} ›</Button>
            )}
          </div>
          <Button variant="primary" onClick={() => void submission.start()}>
            Submit revision {revision}…
          </Button>
        </div>
      )}
    </>
  );
}

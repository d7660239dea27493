// The contractor's side of a return marked "Revise and resubmit" or "Rejected": the
// decision, the findings to answer, the marked-up pages, and the way to start the next
// revision from this one's inputs. While that revision is a draft the findings stay here.
import { useNavigate } from 'react-router-dom';
import { DECISION_LABELS, type Decision } from '@shared/schemas/common';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import { useFindings } from '@/lib/findings-client';
import { returnFileUrl, useReturns } from '../api/returns';
import { useStartRevision } from '../api/start-revision';
import { FindingAnswers } from './finding-answers';

export function ResubmissionPanel({
  packageId,
  decision,
  conditions,
  revisionNumber,
  mode,
}: {
  packageId: string;
  decision: Decision | null;
  /** The engineer's conditions, when the package answer carries them. */
  conditions?: string;
  revisionNumber: number;
  /** "returned": the decision is in and the next revision can start; "revising": it has. */
  mode: 'returned' | 'revising';
}) {
  const navigate = useNavigate();
  const findings = useFindings(packageId);
  const returns = useReturns(packageId);
  const start = useStartRevision(packageId);
  const latestReady = returns.data?.items.find((r) => r.state === 'ready');
  const stampedUrl = latestReady ? returnFileUrl(packageId, latestReady.id) : undefined;
  const next = revisionNumber + 1;
  const rejected = decision === 'rejected';
  // "Answer each finding" only where there are findings to answer.
  const answerFirst = findings.data?.length === 0 ? '' : 'Answer each finding, then s';
  const thenStart = answerFirst || 'S';

  return (
    <section
      aria-labelledby="resubmission-title"
      className={`border-2 bg-sheet ${mode === 'returned' ? 'border-ink' : 'border-rule'}`}
    >
      <header className="flex flex-wrap items-start justify-between gap-3 border-b border-rule px-3 py-2.5">
        <div className="min-w-0">
          <h2 id="resubmission-title" className="text-[16px] font-black">
            {mode === 'returned' ? (
              <>
                Revision {revisionNumber} came back: {decision ? DECISION_LABELS[decision] : 'returned'}
              </>
            ) : (
              <>Findings to answer in revision {revisionNumber}</>
            )}
          </h2>
          <p className="max-w-prose text-[13px] text-ink-soft">
            {mode === 'returned'
              ? rejected
                ? `The engineer of record rejected this revision. Do not lift to it. ${thenStart}tart a new revision with a corrected lift and a new lift plan PDF.`
                : `The engineer of record wants changes before this lift can go ahead. ${thenStart}tart the next revision: it begins with these inputs and no documents, so upload the corrected lift plan PDF.`
              : 'Your answers go with this revision when you submit it. The engineer sees which findings are answered.'}
          </p>
          {mode === 'returned' && conditions && (
            <div className="mt-2 border-l-[3px] border-ink bg-sheet-alt px-2.5 py-1.5 text-[13.5px]">
              <span className="block text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
                Conditions from the engineer of record
              </span>
              <span className="whitespace-pre-line">{conditions}</span>
            </div>
          )}
          {mode === 'returned' && (
            <p className="mt-1 text-[13px]">
              {conditions ? 'The same conditions are' : 'The engineer’s conditions are'} written in the stamp
              block on the first page of the stamped return
              {stampedUrl ? (
                <>
                  {' '}
                  —{' '}
                  <a
                    href={stampedUrl}
                    target="_blank"
                    rel="noopener"
                    className="font-bold text-verdigris underline underline-offset-2"
                  >
                    open the marked-up pages
                  </a>
                </>
              ) : (
                ', which appears here once the lift coordinator issues it'
              )}
              .
            </p>
          )}
        </div>
        {mode === 'returned' && (
          <div className="flex flex-col items-end gap-1">
            <Button
              variant="primary"
              disabled={start.isPending}
              onClick={() =>
                start.mutate(undefined, { onSuccess: () => navigate(`/packages/${packageId}/edit`) })
              }
            >
              {start.isPending ? (
                <>
                  <Spinner className="size-3.5" /> Starting…
                </>
              ) : (
                `Start revision ${next}`
              )}
            </Button>
            {start.isError && (
              <p role="alert" className="max-w-[22rem] text-right text-[13px] font-bold text-fail-ink">
                {isApiError(start.error) && start.error.code === 'not_returned_for_revision'
                  ? 'This package is not waiting for a new revision any more (one may already be started). Reload the page to see where it stands.'
                  : isApiError(start.error)
                    ? start.error.message
                    : 'The new revision could not be started. Try again.'}
              </p>
            )}
          </div>
        )}
      </header>
      {findings.isPending && (
        <p className="flex items-center gap-1.5 px-3 py-2.5 text-[13px] text-ink-soft" role="status">
          <Spinner className="size-3.5" /> Loading the findings…
        </p>
      )}
      {findings.isError && (
        <p role="alert" className="px-3 py-2.5 text-[13px] text-fail-ink">
          The findings could not be loaded.{' '}
          {isApiError(findings.error) ? findings.error.message : 'Reload the page to try again.'}
        </p>
      )}
      {findings.data && (
        <FindingAnswers
          packageId={packageId}
          findings={findings.data}
          canAnswer
          stampedReturnUrl={stampedUrl}
        />
      )}
    </section>
  );
}

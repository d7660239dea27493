// The check run of the current revision: queued (or stored and waiting for the job queue
// to come back), running (with its percent and the step it has reached), done, stopped on
// invalid lift data, or "could not run" with the reason and a button to run it again.
import type { RevisionDetail } from '@shared/schemas/packages';
import { isApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import { useCheckRun, useRetryCheck } from '../../api/check-run';

const STEPS = [
  { upTo: 10, text: 'Loading the revision' },
  { upTo: 30, text: 'Gross load, geometry and chart capacity' },
  { upTo: 55, text: 'Stability, support reactions and ground bearing' },
  { upTo: 80, text: 'Rigging, reeving, power lines, wind, tandem and personnel' },
  { upTo: 95, text: 'Comparing your stated figures' },
  { upTo: 100, text: 'Storing the results' },
];

export function stepFor(progress: number): string {
  return (STEPS.find((s) => progress <= s.upTo) ?? STEPS[STEPS.length - 1]).text;
}

function queuedLine(handOff: string | undefined, failedAttempts: number): string {
  if (handOff === 'waiting_for_queue')
    return 'Submission stored — waiting for the job queue, which is not answering right now';
  if (failedAttempts > 0)
    return `Independent check queued — attempt ${failedAttempts} did not finish, trying again shortly`;
  return 'Independent check queued — waiting for a worker';
}

export function CheckProgress({ packageId, check }: { packageId: string; check: RevisionDetail['check'] }) {
  const watch = check.status === 'queued' || check.status === 'running' || check.status === 'failed';
  const run = useCheckRun(packageId, watch);
  const retry = useRetryCheck(packageId);
  if (check.status === 'none') return null;
  if (check.status === 'queued' || check.status === 'running') {
    const pct = check.status === 'queued' ? 0 : Math.max(0, Math.min(100, check.progress));
    const waiting = run.data?.handOff === 'waiting_for_queue';
    return (
      <section
        aria-label="Independent check"
        className="mb-4 border border-checking-edge bg-checking-tint px-4 py-3"
      >
        <div className="flex items-center gap-2 text-[14px] font-bold text-checking-ink">
          <Spinner />
          {check.status === 'queued'
            ? queuedLine(run.data?.handOff, run.data?.failedAttempts ?? 0)
            : `Independent check running — ${pct}%`}
        </div>
        <div
          role="progressbar"
          aria-label="Independent check progress"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={pct}
          aria-valuetext={`${pct}%: ${stepFor(pct)}`}
          className="mt-2 h-2.5 max-w-[36rem] overflow-hidden rounded-sm border border-checking-edge bg-sheet"
        >
          <div className="h-full bg-checking-ink transition-[width]" style={{ width: `${pct}%` }} />
        </div>
        <p className="mt-1 text-[13px]">
          {waiting
            ? 'Nothing is lost: the check starts on its own as soon as the queue is back. This page updates on its own.'
            : `Step: ${check.status === 'queued' ? 'in the queue' : stepFor(pct)}. This page updates on its own.`}
        </p>
      </section>
    );
  }
  if (check.status === 'failed') {
    const canRetry = run.data?.canRetry ?? false;
    return (
      <section
        role="alert"
        aria-label="Independent check"
        className="mb-4 border border-failed-edge border-l-4 bg-failed-tint px-4 py-3"
      >
        <h2 className="text-[14px] font-bold text-failed-ink">Check could not run</h2>
        <p className="text-[13px]">
          {check.error ?? 'The worker could not finish the check after several attempts.'}
        </p>
        <div className="mt-2 flex flex-wrap items-center gap-3">
          {canRetry ? (
            <Button variant="primary" size="sm" disabled={retry.isPending} onClick={() => retry.mutate()}>
              {retry.isPending ? 'Starting the check…' : 'Run the check again'}
            </Button>
          ) : (
            run.data && (
              <span className="text-[13px]">The contractor or a reviewer can run the check again.</span>
            )
          )}
          {retry.isError && (
            <span role="status" className="text-[13px] text-failed-ink">
              {isApiError(retry.error) ? retry.error.message : 'The check could not be started again.'}
            </span>
          )}
        </div>
      </section>
    );
  }
  if (check.status === 'invalid') {
    return (
      <section
        role="alert"
        aria-label="Independent check"
        className="mb-4 border border-failed-edge border-l-4 bg-failed-tint px-4 py-3"
      >
        <h2 className="text-[14px] font-bold text-failed-ink">The check could not run on this lift data</h2>
        <p className="text-[13px]">
          {check.error ?? 'Some lift data is invalid. Correct it in a new revision.'}
        </p>
      </section>
    );
  }
  return (
    <p className="mb-2 text-[12.5px] text-ink-soft">
      Independent check completed {formatDateTime(check.checkedAt)}
      {check.resultVersion !== null && <> · result format {check.resultVersion}</>}.
    </p>
  );
}

// The check run of the current revision: queued, running (with its percent and the step
// it has reached), done, or stopped with the reason the contractor must act on.
import type { RevisionDetail } from '@shared/schemas/packages';
import { formatDateTime } from '@/lib/format';
import { Spinner } from '@/components/ui/page-loading';

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

export function CheckProgress({ check }: { check: RevisionDetail['check'] }) {
  if (check.status === 'none') return null;
  if (check.status === 'queued' || check.status === 'running') {
    const pct = check.status === 'queued' ? 0 : Math.max(0, Math.min(100, check.progress));
    return (
      <section
        aria-label="Independent check"
        className="mb-4 border border-checking-edge bg-checking-tint px-4 py-3"
      >
        <div className="flex items-center gap-2 text-[14px] font-bold text-checking-ink">
          <Spinner />
          {check.status === 'queued'
            ? 'Independent check queued — waiting for a worker'
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
          Step: {check.status === 'queued' ? 'in the queue' : stepFor(pct)}. This page updates on its own.
        </p>
      </section>
    );
  }
  if (check.status === 'invalid' || check.status === 'failed') {
    return (
      <section
        role="alert"
        aria-label="Independent check"
        className="mb-4 border border-failed-edge border-l-4 bg-failed-tint px-4 py-3"
      >
        <h2 className="text-[14px] font-bold text-failed-ink">
          {check.status === 'invalid' ? 'The check could not run on this lift data' : 'The check run failed'}
        </h2>
        <p className="text-[13px]">
          {check.error ??
            (check.status === 'invalid'
              ? 'Some lift data is invalid. Correct it in a new revision.'
              : 'The worker could not finish. It is retried automatically; if it persists, tell the desk administrator.')}
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

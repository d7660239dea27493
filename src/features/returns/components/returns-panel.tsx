// The stamped returns of a package. The coordinator issues the return once a decision is
// recorded and watches the job's steps; everyone on the package gets the stamped PDF, its
// sha-256, its page count and the public verification link.
import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { DECISION_LABELS, type Decision, type PackageStatus } from '@shared/schemas/common';
import { isApiError } from '@/lib/api-client';
import { formatDateTime, plural } from '@/lib/format';
import { packageKeys } from '@/lib/query-keys';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import type { StampedReturn } from '@shared/schemas/returns';
import { returnFileUrl, useIssueReturn, useReturns, verifyPath } from '../api/returns';
import { shortHash, STAMP_STEPS, stepAt } from '../lib/stamp-steps';
import { CopyButton } from './copy-button';
import { IssuePreviewDialog } from './issue-preview-dialog';

const NOT_STARTED_MS = 20_000;

function StampProgress({ ret }: { ret: StampedReturn }) {
  const current = stepAt(ret.progress);
  const percent = Math.max(0, Math.min(100, Math.round(ret.progress)));
  return (
    <div className="px-3 py-2.5" role="status" aria-label="Stamping progress">
      <p className="mb-1.5 flex items-center gap-1.5 text-[13px] font-bold">
        <Spinner className="size-3.5" /> Building the stamped return ·{' '}
        <span className="tabular">{percent}%</span>
      </p>
      <div
        role="progressbar"
        aria-label="Stamped return"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        className="mb-2 h-2 w-full overflow-hidden border border-rule-strong bg-sheet-alt"
      >
        <div
          className="h-full bg-verdigris transition-[width] duration-500"
          style={{ width: `${percent}%` }}
        />
      </div>
      <ol className="flex flex-col gap-0.5 text-[12.5px]">
        {STAMP_STEPS.map((step, index) => (
          <li
            key={step.label}
            className={`flex items-center gap-1.5 ${index < current ? 'text-ink' : index === current ? 'font-bold text-ink' : 'text-ink-soft'}`}
          >
            <span aria-hidden="true" className="inline-block w-3 text-center">
              {index < current ? '✓' : index === current ? '▸' : '·'}
            </span>
            {step.label}
            <span className="sr-only">
              {index < current ? ' (done)' : index === current ? ' (under way)' : ' (to come)'}
            </span>
          </li>
        ))}
      </ol>
    </div>
  );
}

function ReadyReturn({
  packageId,
  ret,
  revisionNumber,
}: {
  packageId: string;
  ret: StampedReturn;
  revisionNumber: number | undefined;
}) {
  return (
    <li className="flex flex-col gap-1 border-b border-rule px-3 py-2.5 text-[13px] last:border-b-0">
      <div className="flex flex-wrap items-baseline justify-between gap-x-2">
        <span className="font-bold">
          {revisionNumber !== undefined ? `Revision ${revisionNumber}` : 'Stamped return'}
        </span>
        <span className="text-[12px] text-ink-soft">
          Issued {formatDateTime(ret.readyAt ?? ret.createdAt)}
        </span>
      </div>
      <a
        href={returnFileUrl(packageId, ret.id)}
        target="_blank"
        rel="noopener"
        className="inline-flex items-center gap-1.5 font-bold text-verdigris underline underline-offset-2"
      >
        <svg
          className="size-4 shrink-0"
          viewBox="0 0 16 16"
          aria-hidden="true"
          fill="none"
          stroke="currentColor"
        >
          <path d="M3.5 1.5 H9.5 L12.5 4.5 V14.5 H3.5 Z" strokeWidth="1.3" strokeLinejoin="round" />
          <path d="M6 9.5 L8 11.5 L10 9.5 M8 6 V11.5" strokeWidth="1.3" strokeLinecap="round" />
        </svg>
        Open the stamped PDF
        {ret.pages !== null && (
          <span className="font-normal text-ink-soft">({plural(ret.pages, 'page')})</span>
        )}
      </a>
      {ret.sha256 && (
        <div className="flex items-center gap-1.5">
          <span className="text-[12px] text-ink-soft">SHA-256</span>
          <code className="font-mono text-[12px]" title={ret.sha256}>
            {shortHash(ret.sha256)}
          </code>
          <CopyButton text={ret.sha256} label="Copy the full SHA-256" />
        </div>
      )}
      <div className="flex items-center gap-1.5">
        <span className="text-[12px] text-ink-soft">Verify</span>
        <Link
          to={verifyPath(ret.verificationCode)}
          className="truncate font-mono text-[12px] text-verdigris underline underline-offset-2"
        >
          {verifyPath(ret.verificationCode)}
        </Link>
        <CopyButton
          text={`${window.location.origin}${verifyPath(ret.verificationCode)}`}
          label="Copy the verification link"
        />
      </div>
    </li>
  );
}

export function ReturnsPanel({
  packageId,
  status,
  decision,
  canIssue,
  revisions,
}: {
  packageId: string;
  status: PackageStatus;
  decision: Decision | null;
  /** The coordinator, while a recorded decision waits for its return. */
  canIssue: boolean;
  revisions: { id: string; number: number }[];
}) {
  const queryClient = useQueryClient();
  const returns = useReturns(packageId);
  const issue = useIssueReturn(packageId);
  const [previewing, setPreviewing] = useState(false);
  const items = returns.data?.items ?? [];
  const pending = items.find((r) => r.state === 'pending');
  const failed = !pending ? items.find((r) => r.state === 'failed') : undefined;
  const ready = items.filter((r) => r.state === 'ready');
  const hasReady = ready.length > 0;
  // A return the stamping job has not even started after a while (progress 0) may have lost
  // its job; sending it again is harmless, as the job is keyed to the decision.
  const stuck =
    pending !== undefined &&
    pending.progress === 0 &&
    returns.dataUpdatedAt - Date.parse(pending.createdAt) > NOT_STARTED_MS;

  // The job marks the package returned when it stores the file: read the package again.
  useEffect(() => {
    if (hasReady && status === 'decided') {
      void queryClient.invalidateQueries({ queryKey: packageKeys.detail(packageId), exact: true });
      void queryClient.invalidateQueries({ queryKey: packageKeys.lists() });
    }
  }, [hasReady, status, packageId, queryClient]);

  if (!canIssue && items.length === 0 && status !== 'decided' && status !== 'returned') return null;
  const numberOf = (revisionId: string) => revisions.find((r) => r.id === revisionId)?.number;
  const showIssue = canIssue && status === 'decided' && (!pending || stuck);

  return (
    <section aria-labelledby="returns-title" className="border border-rule bg-sheet">
      <h2 id="returns-title" className="border-b border-rule px-3 py-2 text-[14px] font-bold">
        Stamped return
      </h2>
      {showIssue && (
        <div className="flex flex-col items-start gap-2 border-b border-rule bg-decided-tint px-3 py-2.5 text-[13px]">
          {stuck && (
            <p className="font-bold text-caution-ink">
              The stamping job has not started since {formatDateTime(pending.createdAt)}. Send it again; it
              still makes only one stamped return.
            </p>
          )}
          <p>
            {decision ? (
              <>
                The engineer of record decided <strong>{DECISION_LABELS[decision]}</strong>.{' '}
              </>
            ) : null}
            The stamped return carries the original pages with the markups burned in, the stamp block and the
            calculation sheet.
          </p>
          <Button variant="primary" size="sm" disabled={issue.isPending} onClick={() => setPreviewing(true)}>
            {issue.isPending ? (
              <>
                <Spinner className="size-3.5" /> Sending…
              </>
            ) : failed || stuck ? (
              'Issue the stamped return again'
            ) : (
              'Issue stamped return'
            )}
          </Button>
          {issue.isError && (
            <p role="alert" className="font-bold text-fail-ink">
              {isApiError(issue.error) && issue.error.code === 'no_decision'
                ? 'No decision is recorded on this revision yet, so there is nothing to stamp. The engineer of record records the decision first.'
                : isApiError(issue.error)
                  ? issue.error.message
                  : 'The stamped return could not be requested. Try again.'}
            </p>
          )}
        </div>
      )}
      {previewing && (
        <IssuePreviewDialog
          packageId={packageId}
          decision={decision}
          onClose={() => setPreviewing(false)}
          onIssue={() => {
            setPreviewing(false);
            issue.mutate();
          }}
        />
      )}
      {pending && <StampProgress ret={pending} />}
      {failed && (
        <p role="alert" className="border-b border-rule bg-failed-tint px-3 py-2 text-[13px] text-failed-ink">
          <strong>The stamped return could not be built.</strong> {failed.error ?? ''}{' '}
          {canIssue ? 'Issue it again to retry.' : 'The lift coordinator can issue it again.'}
        </p>
      )}
      {returns.isError && (
        <p role="alert" className="px-3 py-2 text-[13px] text-fail-ink">
          The stamped returns could not be loaded.{' '}
          {isApiError(returns.error) ? returns.error.message : 'Reload the page to try again.'}
        </p>
      )}
      {ready.length > 0 ? (
        <ul>
          {ready.map((ret) => (
            <ReadyReturn
              key={ret.id}
              packageId={packageId}
              ret={ret}
              revisionNumber={numberOf(ret.revisionId)}
            />
          ))}
        </ul>
      ) : (
        !pending &&
        !showIssue &&
        returns.isSuccess && (
          <p className="px-3 py-2.5 text-[13px] text-ink-soft">
            No stamped return yet. The lift coordinator issues it once the engineer of record has recorded a
            decision; it appears here with its verification link.
          </p>
        )
      )}
    </section>
  );
}

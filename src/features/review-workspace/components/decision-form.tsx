// The engineer of record's decision: one of the four submittal decisions with conditions.
// It is sent with the package version the engineer has seen; if someone changed the package
// since, the server answers 409 and the form shows what the package says now and lets the
// engineer decide again. Nothing is overwritten without the engineer seeing it. Recording asks
// for the engineer's password in a dialog, which also lists what stands against an acceptance
// and asks for the override reason (decision-confirm-dialog.tsx).
import { useState } from 'react';
import { useCurrentUser } from '@/lib/auth';
import { useKeptDraft } from '@/lib/kept-draft';
import { useQueryClient } from '@tanstack/react-query';
import { DECISION_LABELS, DECISIONS, PACKAGE_STATUS_LABELS, type Decision } from '@shared/schemas/common';
import type { PackageDetail } from '@shared/schemas/packages';
import { isGatedDecision, type DecisionBlocker } from '@shared/rules/decision-gate';
import { StatusBadge } from '@/components/ui/status-badge';
import { Button } from '@/components/ui/button';
import { isApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format';
import { packageKeys } from '@/lib/query-keys';
import { isStaleReview, useRecordDecision } from '../api/record-decision';
import { DecisionConfirmDialog, type Confirmation } from './decision-confirm-dialog';

/** Answers the confirmation dialog shows itself: the password, the override, the wait. */
const DIALOG_STATUSES = [401, 422, 429];

const MEANINGS: Record<Decision, string> = {
  accepted: 'The lift may go ahead as planned.',
  accepted_as_noted: 'The lift may go ahead under the conditions written below.',
  revise_and_resubmit: 'The contractor corrects the plan and sends a new revision.',
  rejected: 'The plan cannot stand; a new plan is needed before any lift.',
};

type Newer = {
  version: number;
  status: PackageDetail['package']['status'];
  decision: Decision | null;
  by: string | null;
  at: string | null;
};

function newerFrom(detail: PackageDetail): Newer {
  const recorded = detail.events.find((e) => e.action === 'decision.recorded');
  return {
    version: detail.package.version,
    status: detail.package.status,
    decision: detail.package.decision,
    by: recorded?.actor ?? null,
    at: recorded?.at ?? null,
  };
}

const isBlank = (text: string) => text.trim() === '';

export function DecisionForm({
  detail,
  canDecide,
  readOnlyReason,
  seenVersion,
  onSeen,
  openFindings,
  openDiscrepancies,
  blockers,
}: {
  detail: PackageDetail;
  canDecide: boolean;
  readOnlyReason: string | null;
  seenVersion: number;
  onSeen: (version: number) => void;
  openFindings: number;
  openDiscrepancies: number;
  /** What stands against Accepted / Accepted as noted now (shared/rules/decision-gate.ts). */
  blockers: DecisionBlocker[];
}) {
  const pkg = detail.package;
  const queryClient = useQueryClient();
  const record = useRecordDecision(pkg.id);
  const [decision, setDecision] = useState<Decision | null>(pkg.decision);
  // Conditions being written are kept in the browser (per person, package and revision), so a
  // reload or a look at another page does not lose them.
  const [conditions, setConditions] = useKeptDraft(
    `conditions:${useCurrentUser().data?.id ?? 'anyone'}:${pkg.id}:${detail.current.number}`,
    '',
    (v) => (typeof v === 'string' ? v : null),
    isBlank,
  );
  const [tried, setTried] = useState(false);
  const [stale, setStale] = useState<Newer | null>(null);
  const [saved, setSaved] = useState<Decision | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [dialogError, setDialogError] = useState<string | null>(null);
  const gated = decision !== null && isGatedDecision(decision) && blockers.length > 0;

  const needsConditions = decision === 'accepted_as_noted' && conditions.trim().length === 0;
  const changedUnderneath = !stale && pkg.version !== seenVersion;

  function submit() {
    setTried(true);
    setSaved(null);
    if (!decision || needsConditions) return;
    setDialogError(null);
    setConfirming(true);
  }

  function confirm(confirmation: Confirmation) {
    if (!decision) return;
    setDialogError(null);
    record.mutate(
      { decision, conditions: conditions.trim(), baseVersion: seenVersion, ...confirmation },
      {
        onSuccess: (next) => {
          setConfirming(false);
          setStale(null);
          setTried(false);
          setSaved(decision);
          onSeen(next.package.version);
        },
        onError: async (error) => {
          if (isApiError(error) && DIALOG_STATUSES.includes(error.status)) {
            setDialogError(error.message);
            return;
          }
          setConfirming(false);
          if (!isStaleReview(error)) return;
          await queryClient.refetchQueries({ queryKey: packageKeys.detail(pkg.id), exact: true });
          const fresh = queryClient.getQueryData<PackageDetail>(packageKeys.detail(pkg.id));
          if (fresh) {
            setStale(newerFrom(fresh));
            onSeen(fresh.package.version);
          } else {
            setStale(newerFrom(detail));
          }
        },
      },
    );
  }

  return (
    <form
      aria-label="Decision"
      noValidate
      className="flex flex-col gap-2 px-3 py-3"
      onSubmit={(event) => {
        event.preventDefault();
        submit();
      }}
    >
      <div className="flex flex-wrap items-center gap-2 text-[13px]">
        <span className="font-bold">Now</span>
        <StatusBadge status={pkg.status} />
        <span data-testid="current-decision" className="font-bold">
          {pkg.decision ? DECISION_LABELS[pkg.decision] : 'No decision recorded'}
        </span>
        <span className="text-ink-soft">· version {pkg.version}</span>
      </div>
      <p className="text-[12.5px] text-ink-soft">
        {openFindings} {openFindings === 1 ? 'finding' : 'findings'} not closed · {openDiscrepancies} stated{' '}
        {openDiscrepancies === 1 ? 'figure' : 'figures'} disagreeing and not accepted
      </p>

      {stale && (
        <div
          role="alert"
          className="border border-l-4 border-caution-ink bg-caution-tint px-3 py-2 text-[13px]"
        >
          <p className="font-bold">Someone changed this package after you opened it.</p>
          <p>
            It now reads: {PACKAGE_STATUS_LABELS[stale.status]}
            {stale.decision && (
              <>
                {' '}
                — <strong data-testid="newer-decision">{DECISION_LABELS[stale.decision]}</strong>
              </>
            )}
            {stale.by && (
              <>
                {' '}
                (recorded by {stale.by}
                {stale.at && `, ${formatDateTime(stale.at)}`})
              </>
            )}
            . Your decision was not saved. Read the newer version, then record your decision again.
          </p>
        </div>
      )}
      {changedUnderneath && (
        <p role="status" className="border border-l-4 border-ready-edge bg-ready-tint px-3 py-2 text-[13px]">
          The package has changed since you opened it (version {seenVersion} → {pkg.version}). Saving will ask
          you to confirm against the newer version.
        </p>
      )}
      {!canDecide && readOnlyReason && <p className="text-[13px] text-ink-soft">{readOnlyReason}</p>}

      <fieldset disabled={!canDecide} className="flex flex-col gap-1">
        <legend className="mb-1 text-[13px] font-bold">Decision</legend>
        {DECISIONS.map((d) => (
          <label
            key={d}
            className={`flex items-start gap-2 border px-2 py-1.5 text-[13px] ${decision === d ? 'border-verdigris bg-verdigris-tint' : 'border-rule bg-sheet'}`}
          >
            <input
              type="radio"
              name="decision"
              value={d}
              checked={decision === d}
              onChange={() => setDecision(d)}
              className="mt-1"
            />
            <span>
              <span className="block font-bold">{DECISION_LABELS[d]}</span>
              <span className="block text-[12.5px] text-ink-soft">{MEANINGS[d]}</span>
            </span>
          </label>
        ))}
        {tried && !decision && (
          <p role="alert" className="text-[12.5px] font-bold text-fail-ink">
            Choose one of the four decisions.
          </p>
        )}
        <label htmlFor="decision-conditions" className="mt-1 text-[13px] font-bold">
          Conditions{' '}
          <span className="font-normal text-ink-soft">
            {decision === 'accepted_as_noted'
              ? '(required with Accepted as noted)'
              : '(printed on the stamped return)'}
          </span>
        </label>
        <textarea
          id="decision-conditions"
          rows={4}
          maxLength={4000}
          value={conditions}
          aria-invalid={tried && needsConditions}
          aria-describedby={tried && needsConditions ? 'conditions-error' : undefined}
          onChange={(event) => setConditions(event.target.value)}
          className="border border-rule-strong bg-sheet px-2 py-1 text-[13px] disabled:bg-sheet-alt"
        />
        {tried && needsConditions && (
          <p id="conditions-error" role="alert" className="text-[12.5px] font-bold text-fail-ink">
            Write the conditions the lift must meet: Accepted as noted needs them.
          </p>
        )}
      </fieldset>
      {gated && canDecide && (
        <p
          data-testid="gate-note"
          className="border border-l-4 border-fail-ink bg-fail-tint px-3 py-2 text-[13px]"
        >
          {blockers.length === 1 ? 'One item stands' : `${blockers.length} items stand`} against{' '}
          {DECISION_LABELS[decision]}: recording it asks for your override reason in writing.
        </p>
      )}
      {record.isError && !confirming && !isStaleReview(record.error) && (
        <p role="alert" className="text-[12.5px] font-bold text-fail-ink">
          {isApiError(record.error) ? record.error.message : 'The decision could not be recorded.'}
        </p>
      )}
      {saved && (
        <p role="status" className="text-[13px] font-bold text-decided-ink">
          Recorded: {DECISION_LABELS[saved]}. The coordinator issues the stamped return.
        </p>
      )}
      <div>
        <Button type="submit" variant="primary" disabled={!canDecide || record.isPending}>
          {record.isPending
            ? 'Recording…'
            : stale
              ? 'Record my decision on the newer version'
              : 'Record the decision'}
        </Button>
      </div>
      {confirming && decision && (
        <DecisionConfirmDialog
          decision={decision}
          conditions={conditions.trim()}
          blockers={isGatedDecision(decision) ? blockers : []}
          pending={record.isPending}
          error={dialogError}
          onConfirm={confirm}
          onClose={() => setConfirming(false)}
        />
      )}
    </form>
  );
}

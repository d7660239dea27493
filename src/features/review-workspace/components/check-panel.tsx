// The recomputed lift beside the pages: the stated figures that disagree first, each with
// "Accept the stated figure" (a reason is required) or "Raise a finding"; then every check,
// worst first, compact enough for a side column, with its formula and source on demand. A lift with
// several cranes shows each crane's share, gross load and worst check above the checks.
import { useState } from 'react';
import { formatFormula, formatPercent, formatQuantity } from '@shared/engineering/format';
import type { CheckResult, Discrepancy, LiftResult, UnitSystem } from '@shared/engineering/types';
import { CheckStatusMark, DisagreeMark } from '@/components/ui/check-status-mark';
import { Button } from '@/components/ui/button';
import { formatCheckLimit, formatCheckValue, SOURCE_KIND_LABELS } from '@/components/lift/result-format';
import { sortChecks, sortDiscrepancies } from '@/components/lift/result-order';
import { CraneShares } from '@/components/lift/crane-shares';
import { isApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format';
import { useAcceptFigure } from '../api/accept-figure';
import { figureCheckId, type AcceptedFigure } from '../lib/accepted-figures';

export type RaiseFinding = { checkId: string; label: string; text: string };

const MIN_REASON = 5;

function figureValue(si: number | null, d: Discrepancy, system: UnitSystem) {
  if (si === null) return '—';
  return d.unit === 'percent' ? formatPercent(si) : formatQuantity(si, d.unit, system);
}

function AcceptedMark() {
  return (
    <span className="inline-flex items-center gap-1 rounded-sm bg-decided-tint px-1.5 text-[12px] font-bold leading-5 text-decided-ink">
      <svg
        className="size-3.5"
        viewBox="0 0 14 14"
        aria-hidden="true"
        fill="none"
        stroke="currentColor"
        strokeWidth="1.6"
      >
        <rect x="1.5" y="1.5" width="11" height="11" rx="1" />
        <path d="M4 7.2 L6 9.2 L10 4.8" />
      </svg>
      Accepted
    </span>
  );
}

function DiscrepancyCard({
  packageId,
  d,
  system,
  accepted,
  editable,
  onRaise,
  onAccepted,
}: {
  packageId: string;
  d: Discrepancy;
  system: UnitSystem;
  accepted: AcceptedFigure | undefined;
  editable: boolean;
  onRaise: (raise: RaiseFinding) => void;
  onAccepted: (version: number) => void;
}) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [tried, setTried] = useState(false);
  const accept = useAcceptFigure(packageId);
  const tooShort = reason.trim().length < MIN_REASON;
  const reasonId = `reason-${d.figure}`;
  const errorId = `reason-error-${d.figure}`;

  return (
    <li className="border-b border-rule px-3 py-2 last:border-b-0" data-testid="discrepancy-item">
      <div className="flex items-start justify-between gap-2">
        <div className="min-w-0">
          {/* The engine's message repeats the figures in SI; the grid below shows them in the reader's units. */}
          <p className="text-[13.5px] font-bold">{d.label}</p>
        </div>
        <div className="flex shrink-0 flex-col items-end gap-0.5">
          {accepted ? <AcceptedMark /> : <DisagreeMark />}
          {d.unsafeSide && <span className="text-[12px] font-bold text-fail-ink">▲ unsafe side</span>}
        </div>
      </div>
      <dl className="mt-1 grid grid-cols-3 gap-2 text-[12.5px] tabular">
        <div>
          <dt className="text-ink-soft">Stated</dt>
          <dd className="font-bold">{figureValue(d.stated, d, system)}</dd>
        </div>
        <div>
          <dt className="text-ink-soft">Recomputed</dt>
          <dd className="font-bold">{figureValue(d.computed, d, system)}</dd>
        </div>
        <div>
          <dt className="text-ink-soft">Difference</dt>
          <dd>
            <span className="font-bold">
              {d.differencePct === null ? '—' : formatPercent(d.differencePct)}
            </span>{' '}
            <span className="text-ink-soft">(tolerance {formatPercent(d.tolerancePct)})</span>
          </dd>
        </div>
      </dl>
      {accepted && (
        <p className="mt-1.5 border-l-4 border-decided-edge bg-decided-tint/60 px-2 py-1 text-[12.5px]">
          <span className="font-bold">Reason: </span>
          {accepted.reason}
          <span className="block text-[12px] text-ink-soft">
            {accepted.by ?? 'Engineer of record'} · {formatDateTime(accepted.at)}
          </span>
        </p>
      )}
      {editable && !open && (
        <div className="mt-1.5 flex flex-wrap gap-1.5">
          {!accepted && (
            <Button size="sm" onClick={() => setOpen(true)}>
              Accept the stated figure
            </Button>
          )}
          <Button
            size="sm"
            variant="quiet"
            onClick={() =>
              onRaise({
                checkId: figureCheckId(d.figure),
                label: `Stated figure: ${d.label}`,
                text: `${d.label}: stated ${figureValue(d.stated, d, system)}, recomputed ${figureValue(d.computed, d, system)}. `,
              })
            }
          >
            Raise a finding
          </Button>
        </div>
      )}
      {editable && open && (
        <form
          className="mt-1.5 flex flex-col gap-1"
          noValidate
          onSubmit={(event) => {
            event.preventDefault();
            setTried(true);
            if (tooShort) return;
            accept.mutate(
              { figure: d.figure, reason: reason.trim() },
              {
                onSuccess: (detail) => {
                  setOpen(false);
                  setReason('');
                  setTried(false);
                  onAccepted(detail.package.version);
                },
              },
            );
          }}
        >
          <label htmlFor={reasonId} className="text-[12.5px] font-bold">
            Why the stated {d.label.toLowerCase()} is acceptable
          </label>
          <textarea
            id={reasonId}
            rows={2}
            value={reason}
            maxLength={2000}
            aria-invalid={tried && tooShort}
            aria-describedby={tried && tooShort ? errorId : undefined}
            onChange={(event) => setReason(event.target.value)}
            className="border border-rule-strong bg-sheet px-2 py-1 text-[13px]"
          />
          {tried && tooShort && (
            <p id={errorId} role="alert" className="text-[12.5px] font-bold text-fail-ink">
              Write the reason (at least {MIN_REASON} characters): it is printed on the stamped return.
            </p>
          )}
          {accept.isError && (
            <p role="alert" className="text-[12.5px] font-bold text-fail-ink">
              {isApiError(accept.error) ? accept.error.message : 'The figure could not be accepted.'}
            </p>
          )}
          <div className="flex gap-1.5">
            <Button size="sm" variant="primary" type="submit" disabled={accept.isPending}>
              {accept.isPending ? 'Accepting…' : 'Accept with this reason'}
            </Button>
            <Button size="sm" variant="quiet" onClick={() => setOpen(false)}>
              Cancel
            </Button>
          </div>
        </form>
      )}
    </li>
  );
}

function CheckRow({
  check,
  result,
  system,
  editable,
  findings,
  onRaise,
}: {
  check: CheckResult;
  result: LiftResult;
  system: UnitSystem;
  editable: boolean;
  findings: number;
  onRaise: (raise: RaiseFinding) => void;
}) {
  const [open, setOpen] = useState(false);
  return (
    <li className="border-b border-rule last:border-b-0" data-testid="workspace-check-row">
      <div className="flex items-start gap-2 px-3 py-1.5">
        <div className="min-w-[6.6rem] shrink-0">
          <CheckStatusMark status={check.status} />
        </div>
        <button
          type="button"
          aria-expanded={open}
          onClick={() => setOpen(!open)}
          className="min-w-0 flex-1 text-left"
        >
          <span className="block text-[13px] font-bold leading-5">{check.label}</span>
          <span className="block text-[12.5px] text-ink-soft tabular">
            {formatCheckValue({ ...check, id: check.id }, result, system)}
            {check.limit !== null && <> · limit {formatCheckLimit(check, system)}</>}
            {findings > 0 && (
              <span className="ml-1 font-bold text-ink">
                · {findings} {findings === 1 ? 'finding' : 'findings'}
              </span>
            )}
          </span>
        </button>
        {editable && (
          <Button
            size="sm"
            variant="quiet"
            className="shrink-0"
            aria-label={`Raise a finding on ${check.label}`}
            onClick={() => onRaise({ checkId: check.id, label: check.label, text: '' })}
          >
            + Finding
          </Button>
        )}
      </div>
      {open && (
        <div className="bg-sheet-alt px-3 py-1.5 text-[12.5px] leading-snug">
          {check.message && <p className="mb-1">{check.message}</p>}
          <p>
            <span className="font-bold">Formula: </span>
            {formatFormula(check.formula, system) || '—'}
          </p>
          <p>
            <span className="font-bold">Limit from: </span>
            {SOURCE_KIND_LABELS[check.source.kind] ?? check.source.kind} — {check.source.text}
          </p>
          {check.items.length > 1 && (
            <ul className="mt-1 flex flex-col gap-0.5">
              {check.items.map((item) => (
                <li key={item.id} className="flex items-center justify-between gap-2">
                  <span>{item.label}</span>
                  <span className="flex items-center gap-2 tabular">
                    {formatCheckValue({ ...item, id: item.id }, result, system)}
                    <CheckStatusMark status={item.status} />
                  </span>
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </li>
  );
}

export function CheckPanel({
  packageId,
  result,
  system,
  accepted,
  editable,
  findingsByCheck,
  onRaise,
  onAccepted,
}: {
  packageId: string;
  result: LiftResult | null;
  system: UnitSystem;
  accepted: Map<string, AcceptedFigure>;
  editable: boolean;
  findingsByCheck: Map<string, number>;
  onRaise: (raise: RaiseFinding) => void;
  onAccepted: (version: number) => void;
}) {
  if (!result) {
    return (
      <p className="px-3 py-4 text-[13px] text-ink-soft">
        The independent check has not produced results for this revision yet. They appear here when the check
        run finishes.
      </p>
    );
  }
  const disagreements = sortDiscrepancies(result.discrepancies).filter((d) => d.status === 'discrepancy');
  const open = disagreements.filter((d) => !accepted.has(d.figure)).length;
  return (
    <div className="flex flex-col">
      <section aria-labelledby="ws-disagreements">
        <h3
          id="ws-disagreements"
          className="sticky top-0 z-[1] border-b border-rule bg-sheet-alt px-3 py-1.5 text-[13px] font-bold"
        >
          Stated figures that disagree{' '}
          <span className="font-normal text-ink-soft">
            · {disagreements.length === 0 ? 'none' : `${open} of ${disagreements.length} not accepted`}
          </span>
        </h3>
        {disagreements.length === 0 ? (
          <p className="px-3 py-2 text-[13px] text-ink-soft">
            Every figure the contractor stated agrees within the site’s tolerance.
          </p>
        ) : (
          <ul>
            {disagreements.map((d) => (
              <DiscrepancyCard
                key={d.figure}
                packageId={packageId}
                d={d}
                system={system}
                accepted={accepted.get(d.figure)}
                editable={editable}
                onRaise={onRaise}
                onAccepted={onAccepted}
              />
            ))}
          </ul>
        )}
      </section>
      {result.cranes && (
        <div className="border-b border-rule px-3 py-2">
          <CraneShares result={result} system={system} compact />
        </div>
      )}
      <section aria-labelledby="ws-checks">
        <h3
          id="ws-checks"
          className="sticky top-0 z-[1] border-y border-rule bg-sheet-alt px-3 py-1.5 text-[13px] font-bold"
        >
          Recomputed checks <span className="font-normal text-ink-soft">· worst first</span>
        </h3>
        <ul>
          {sortChecks(result.checks).map((check) => (
            <CheckRow
              key={check.id}
              check={check}
              result={result}
              system={system}
              editable={editable}
              findings={findingsByCheck.get(check.id) ?? 0}
              onRaise={onRaise}
            />
          ))}
        </ul>
      </section>
    </div>
  );
}

// The last step of a decision: the engineer reads what they are about to record and confirms it
// with their own password. Accepted or Accepted as noted while something stands against it
// (a failing check, a Major finding not closed, a disagreeing figure not accepted) lists those
// items in words and asks why the lift may go ahead anyway; the reason prints on the return.
import { useState } from 'react';
import { DECISION_LABELS, type Decision } from '@shared/schemas/common';
import type { DecisionBlocker } from '@shared/rules/decision-gate';
import { OVERRIDE_REASON_MAX, OVERRIDE_REASON_MIN } from '@shared/schemas/reviews';
import { Button } from '@/components/ui/button';
import { CheckShape } from '@/components/ui/check-status-mark';
import { Dialog } from '@/components/ui/dialog';
import { FormAlert } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/page-loading';

export type Confirmation = { overrideReason: string; password: string };

export function DecisionConfirmDialog({
  decision,
  conditions,
  blockers,
  pending,
  error,
  onConfirm,
  onClose,
}: {
  decision: Decision;
  conditions: string;
  /** What stands against an acceptance; empty, or not an acceptance: nothing to override. */
  blockers: DecisionBlocker[];
  pending: boolean;
  error: string | null;
  onConfirm: (confirmation: Confirmation) => void;
  onClose: () => void;
}) {
  const [reason, setReason] = useState('');
  const [password, setPassword] = useState('');
  const [tried, setTried] = useState(false);
  const overriding = blockers.length > 0;
  const reasonShort = overriding && reason.trim().length < OVERRIDE_REASON_MIN;
  const passwordMissing = password.length === 0;
  const label = DECISION_LABELS[decision];

  function confirm() {
    setTried(true);
    if (reasonShort || passwordMissing) return;
    onConfirm({ overrideReason: overriding ? reason.trim() : '', password });
    setPassword('');
  }

  return (
    <Dialog
      title={overriding ? `${label} over what stands against it` : `Confirm: ${label}`}
      description={
        overriding
          ? `${blockers.length === 1 ? 'One item stands' : `${blockers.length} items stand`} against letting the lift go ahead. Record ${label} only with your reason in writing: it prints on the stamped return and stays in the package history.`
          : 'Your decision is recorded under your name with the inputs and results you reviewed.'
      }
      onClose={onClose}
      width={overriding ? 'max-w-[640px]' : 'max-w-[480px]'}
    >
      <form
        aria-label="Confirm the decision"
        noValidate
        className="flex flex-col gap-3 text-[13.5px]"
        onSubmit={(event) => {
          // The dialog is portalled but sits inside the decision form in React's tree: its submit
          // must not reach that form too.
          event.preventDefault();
          event.stopPropagation();
          confirm();
        }}
      >
        {error && <FormAlert>{error}</FormAlert>}
        {overriding && (
          <section aria-labelledby="blockers-title" className="border border-fail-ink/40 bg-fail-tint/40">
            <h3
              id="blockers-title"
              className="border-b border-fail-ink/30 px-3 py-1.5 text-[13px] font-black"
            >
              Standing against {label}
            </h3>
            <ul className="flex max-h-[16rem] flex-col overflow-y-auto" data-testid="decision-blockers">
              {blockers.map((b, i) => (
                <li key={i} className="flex gap-2 border-b border-rule px-3 py-1.5 last:border-b-0">
                  <span className="mt-0.5 text-fail-ink">
                    <CheckShape status={b.kind === 'unaccepted_figure' ? 'caution' : 'fail'} />
                  </span>
                  <span>
                    <span className="block font-bold">{b.title}</span>
                    <span className="block text-ink-soft">{b.text}</span>
                  </span>
                </li>
              ))}
            </ul>
          </section>
        )}
        <p>
          <span className="font-bold">Decision:</span> {label}
          {conditions && (
            <>
              {' '}
              · <span className="font-bold">Conditions:</span>{' '}
              <span className="whitespace-pre-wrap">{conditions}</span>
            </>
          )}
        </p>
        {overriding && (
          <div className="flex flex-col gap-1">
            <label htmlFor="override-reason" className="font-bold">
              Override reason{' '}
              <span className="font-normal text-ink-soft">(required, printed on the return)</span>
            </label>
            <textarea
              id="override-reason"
              rows={4}
              maxLength={OVERRIDE_REASON_MAX}
              value={reason}
              aria-invalid={tried && reasonShort}
              aria-describedby={tried && reasonShort ? 'override-reason-error' : undefined}
              onChange={(event) => setReason(event.target.value)}
              className="border border-rule-strong bg-sheet px-2 py-1"
            />
            {tried && reasonShort && (
              <p id="override-reason-error" role="alert" className="text-[12.5px] font-bold text-fail-ink">
                Write why the lift may go ahead despite the items above (at least {OVERRIDE_REASON_MIN}{' '}
                characters).
              </p>
            )}
          </div>
        )}
        <div className="flex flex-col gap-1">
          <label htmlFor="decision-password" className="font-bold">
            Your password{' '}
            <span className="font-normal text-ink-soft">(confirms that you make this decision)</span>
          </label>
          <input
            id="decision-password"
            type="password"
            autoComplete="current-password"
            value={password}
            aria-invalid={tried && passwordMissing}
            aria-describedby={tried && passwordMissing ? 'decision-password-error' : undefined}
            onChange={(event) => setPassword(event.target.value)}
            className="h-9 max-w-[320px] border border-rule-strong bg-sheet px-2"
          />
          {tried && passwordMissing && (
            <p id="decision-password-error" role="alert" className="text-[12.5px] font-bold text-fail-ink">
              Enter your password to confirm the decision.
            </p>
          )}
        </div>
        <div className="mt-1 flex justify-end gap-2 border-t border-rule pt-3">
          <Button onClick={onClose}>Go back</Button>
          <Button type="submit" variant="primary" disabled={pending}>
            {pending && <Spinner />}
            {pending ? 'Recording…' : overriding ? `Override and record ${label}` : `Record ${label}`}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}

// The last step: the package's title and planned lift date, and what still needs attention
// before the revision can be submitted, step by step, each a way back to that step.
import { STEPS, type StepId } from '@shared/catalogue/lift-fields';
import type { Problem } from '../../hooks/use-submit-revision';

export function ReviewStep({
  title,
  onTitle,
  plannedLiftDate,
  onPlannedLiftDate,
  problems,
  planMissing,
  revision,
  onGoTo,
  failingChecks,
}: {
  title: string;
  onTitle: (value: string) => void;
  plannedLiftDate: string;
  onPlannedLiftDate: (value: string) => void;
  problems: Problem[];
  planMissing: boolean;
  revision: number;
  onGoTo: (step: StepId) => void;
  /** Checks the live check fails on the data as it stands. */
  failingChecks: string[];
}) {
  const titleError =
    title.trim().length < 3 ? 'The title must be at least 3 characters (it is not saved until it is).' : null;
  const byStep = STEPS.map((s) => ({ step: s, items: problems.filter((p) => p.step === s.id) })).filter(
    (entry) => entry.items.length > 0 || (entry.step.id === 'documents' && planMissing),
  );
  return (
    <div className="flex flex-col gap-4">
      <fieldset className="grid grid-cols-[repeat(auto-fill,minmax(16rem,1fr))] gap-3">
        <legend className="mb-2 text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
          Package
        </legend>
        <label className="flex flex-col gap-1 text-[13px] font-bold">
          Lift title
          <input
            value={title}
            maxLength={200}
            onChange={(event) => onTitle(event.target.value)}
            aria-invalid={titleError ? true : undefined}
            className="h-8 rounded-[3px] border border-rule-strong bg-sheet px-2 text-[14px] font-normal aria-[invalid=true]:border-2 aria-[invalid=true]:border-failed-ink"
          />
          {titleError && <span className="text-[12.5px] text-failed-ink">{titleError}</span>}
        </label>
        <label className="flex flex-col gap-1 text-[13px] font-bold">
          Planned lift date
          <input
            type="date"
            value={plannedLiftDate}
            onChange={(event) => onPlannedLiftDate(event.target.value)}
            className="h-8 rounded-[3px] border border-rule-strong bg-sheet px-2 text-[14px] font-normal"
          />
        </label>
      </fieldset>
      {failingChecks.length > 0 && (
        <p role="status" className="border-l-4 border-failed-ink bg-failed-tint px-3 py-2 text-[13px]">
          <strong>The live check fails:</strong> {failingChecks.join('; ')}. You can still submit; the
          independent check will very likely fail the same way, and the engineer of record sees it. Consider
          correcting the lift first.
        </p>
      )}
      <section aria-label="Before you submit">
        <h3 className="text-[14px] font-bold">Before you submit revision {revision}</h3>
        {byStep.length === 0 ? (
          <p className="text-[13px] text-ink-soft">
            No errors found so far. Submitting checks every field again, and the lift plan PDF.
          </p>
        ) : (
          <ul className="mt-1 flex flex-col gap-1 text-[13px]">
            {byStep.map(({ step, items }) => (
              <li key={step.id}>
                <button
                  type="button"
                  onClick={() => onGoTo(step.id)}
                  className="font-bold text-verdigris underline underline-offset-2"
                >
                  {step.title}
                </button>
                :{' '}
                {step.id === 'documents' && planMissing
                  ? 'the lift plan PDF is missing'
                  : `${items.length} ${items.length === 1 ? 'field needs' : 'fields need'} attention (${items
                      .slice(0, 3)
                      .map((item) => item.label)
                      .join('; ')}${items.length > 3 ? '; …' : ''})`}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

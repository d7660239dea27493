// The list of the form's steps, the current one marked, and ✕ beside each step with errors.
import { STEPS, type StepId } from '@shared/catalogue/lift-fields';

export function StepNav({
  step,
  errorSteps,
  onGoTo,
}: {
  step: StepId;
  errorSteps: ReadonlySet<StepId>;
  onGoTo: (step: StepId) => void;
}) {
  return (
    <nav aria-label="Steps" className="lg:sticky lg:top-4">
      <ol className="flex flex-col border border-rule bg-sheet">
        {STEPS.map((s, i) => {
          const active = s.id === step;
          return (
            <li key={s.id}>
              <button
                type="button"
                onClick={() => onGoTo(s.id)}
                aria-current={active ? 'step' : undefined}
                className={`flex w-full items-center gap-2 border-l-4 px-2.5 py-2 text-left text-[13.5px] ${
                  active
                    ? 'border-ink bg-sheet-alt font-black'
                    : 'border-transparent font-bold hover:bg-sheet-alt'
                }`}
              >
                <span className="w-4 tabular text-ink-soft">{i + 1}</span>
                <span className="flex-1">{s.title}</span>
                {errorSteps.has(s.id) && (
                  <span
                    className="inline-flex items-center gap-0.5 text-[12px] font-bold text-fail-ink"
                    data-testid={`step-error-${s.id}`}
                  >
                    <span aria-hidden="true">✕</span>
                    <span className="sr-only">has errors</span>
                  </span>
                )}
              </button>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}

// The contractor's submission editor: the lift in steps, each field checked against the
// shared LiftInput schema as it is typed, the live check beside the form, autosave to the
// server, the documents, and the submit that freezes the revision. This file composes: the
// form and its issues are in ../../hooks/use-lift-form.ts, the submit in use-submit-revision.ts.
import { useCallback, useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { FormProvider } from 'react-hook-form';
import { useSearchParams } from 'react-router-dom';
import type { UnitSystem } from '@shared/schemas/common';
import type { PackageDetail } from '@shared/schemas/packages';
import { STEPS, stepOfPath, type StepId } from '@shared/catalogue/lift-fields';
import { readableField } from '@shared/catalogue/readable-issue';
import { draftInputs } from '../../lib/prune';
import { useDraftAutosave } from '../../hooks/use-draft-autosave';
import { formValues, isTouched, useLiftForm, useLiftIssues, useLiftValues } from '../../hooks/use-lift-form';
import { useSubmitRevision } from '../../hooks/use-submit-revision';
import { useLibraryFill, type EditorLibrary } from '../../hooks/use-library-fill';
import { isLibraryPath } from '@shared/library/to-lift-input';
import { ChartRowsEditor } from './chart-rows-editor';
import { FieldGroups, MultiCraneEditor } from './multi-crane-editor';
import { LiveCheckPanel, runLiveCheck } from './live-check-panel';
import { DocumentsStep } from './documents-step';
import { EditorHeader } from './editor-header';
import { errorPaths, IssuesContext } from './field-errors';
import { ReviewStep } from './review-step';
import { StepNav } from './step-nav';
import { SubmitBar } from './submit-bar';

export function SubmissionEditor({
  detail,
  system,
  library,
}: {
  detail: PackageDetail;
  system: UnitSystem;
  library?: EditorLibrary;
}) {
  const [params, setParams] = useSearchParams();
  const packageId = detail.package.id;
  const stepParam = params.get('step');
  const step: StepId = STEPS.some((s) => s.id === stepParam) ? (stepParam as StepId) : 'crane';

  const form = useLiftForm(detail);
  const { control, reset, formState } = form;
  const values = useLiftValues(control);
  const fillFromLibrary = useLibraryFill(form);
  // A fill from the library remounts the chart rows editor: its rows and column units are read again.
  const [chartFills, setChartFills] = useState(0);

  const [title, setTitle] = useState(detail.package.title);
  const [plannedLiftDate, setPlannedLiftDate] = useState(detail.package.plannedLiftDate ?? '');
  const meta = useRef({ title, plannedLiftDate });
  useEffect(() => {
    meta.current = { title, plannedLiftDate };
  }, [title, plannedLiftDate]);

  const getPayload = useCallback(() => {
    const t = meta.current.title.trim();
    return {
      inputs: draftInputs(form.getValues()),
      ...(t.length >= 3 ? { title: t } : {}),
      plannedLiftDate: meta.current.plannedLiftDate || null,
    };
  }, [form]);

  const onReload = useCallback(
    (fresh: PackageDetail) => {
      reset(formValues(fresh.current.inputs));
      setTitle(fresh.package.title);
      setPlannedLiftDate(fresh.package.plannedLiftDate ?? '');
    },
    [reset],
  );

  const autosave = useDraftAutosave({ packageId, initial: detail, getPayload, onReload });
  const { schedule } = autosave;

  // Every change to the lift schedules a save.
  useEffect(
    () => form.subscribe({ formState: { values: true }, callback: () => schedule() }),
    [form, schedule],
  );

  // The checks the live check fails, named on the review step and in the submit confirmation.
  const deferredValues = useDeferredValue(values);
  const failingChecks = useMemo(() => {
    const outcome = runLiveCheck(deferredValues, system);
    return outcome.ok === true
      ? outcome.result.checks.filter((c) => c.status === 'fail').map((c) => c.label)
      : [];
  }, [deferredValues, system]);

  const [showAll, setShowAll] = useState(false);
  const issues = useLiftIssues(values, showAll);
  const submission = useSubmitRevision({
    detail,
    form,
    flush: autosave.flush,
    onShowAll: () => setShowAll(true),
  });

  // Paths with something to say: react-hook-form's errors, and the schema's for touched fields
  // (or all of them after a submit was tried).
  const problemPaths = useMemo(
    () => [
      ...new Set([
        ...errorPaths(formState.errors),
        ...[...issues.byPath.keys()].filter(
          (path) => issues.showAll || isTouched(formState.touchedFields, path),
        ),
      ]),
    ],
    [formState, issues],
  );
  const errorSteps = useMemo(() => {
    const steps = new Set<StepId>(problemPaths.map(stepOfPath));
    for (const problem of submission.serverProblems) steps.add(problem.step);
    if (submission.planMissing) steps.add('documents');
    return steps;
  }, [problemPaths, submission.serverProblems, submission.planMissing]);

  function goTo(id: StepId) {
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        next.set('step', id);
        return next;
      },
      { replace: true },
    );
  }

  const current = STEPS.find((s) => s.id === step) ?? STEPS[0];
  const index = STEPS.indexOf(current);
  const live: Record<string, unknown> = values;

  return (
    <FormProvider {...form}>
      <IssuesContext.Provider value={issues}>
        <EditorHeader detail={detail} title={title} autosave={autosave} />

        <div className="grid items-start gap-4 lg:grid-cols-[12.5rem_minmax(0,1fr)] wide:grid-cols-[12.5rem_minmax(0,1fr)_22rem]">
          <StepNav step={step} errorSteps={errorSteps} onGoTo={goTo} />

          <section aria-labelledby="step-title" className="min-w-0 border border-rule bg-sheet px-4 py-3">
            <h2 id="step-title" className="mb-3 text-[17px] font-black">
              {index + 1}. {current.title}
            </h2>
            {(step === 'crane' || step === 'chart') &&
              library?.picker((f) => {
                fillFromLibrary(f, 0);
                setChartFills((n) => n + 1);
              }, 0)}
            <FieldGroups
              groups={current.groups}
              values={live}
              system={system}
              locked={library?.locked(0) ? isLibraryPath : undefined}
            />
            {step === 'chart' && (
              <ChartRowsEditor key={chartFills} system={system} disabled={!!library?.locked(0)} />
            )}
            {step === 'cranes' && (
              <MultiCraneEditor system={system} library={library && { ...library, fill: fillFromLibrary }} />
            )}
            {step === 'documents' && (
              <DocumentsStep
                detail={detail}
                onFilesChanged={autosave.adopt}
                planMissing={submission.planMissing}
              />
            )}
            {step === 'review' && (
              <ReviewStep
                title={title}
                onTitle={(value) => {
                  setTitle(value);
                  meta.current = { ...meta.current, title: value };
                  schedule();
                }}
                plannedLiftDate={plannedLiftDate}
                onPlannedLiftDate={(value) => {
                  setPlannedLiftDate(value);
                  meta.current = { ...meta.current, plannedLiftDate: value };
                  schedule();
                }}
                problems={problemPaths.map((path) => ({
                  step: stepOfPath(path),
                  label: readableField(path),
                  message: '',
                }))}
                planMissing={submission.planMissing}
                revision={detail.current.number}
                onGoTo={goTo}
                failingChecks={failingChecks}
              />
            )}
            <SubmitBar
              index={index}
              revision={detail.current.number}
              submission={submission}
              onGoTo={goTo}
              failingChecks={failingChecks}
            />
          </section>

          <div className="lg:col-start-2 wide:sticky wide:top-4 wide:col-start-3 wide:row-start-1">
            <LiveCheckPanel values={values} system={system} />
          </div>
        </div>
      </IssuesContext.Provider>
    </FormProvider>
  );
}

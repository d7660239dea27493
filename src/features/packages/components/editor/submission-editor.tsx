// The contractor's submission editor: the lift in steps, each field checked against the
// shared LiftInput schema as it is typed, the live check beside the form, autosave to the
// server, the documents, and the submit that freezes the revision.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { FormProvider, useForm, useWatch, type FieldValues, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { LiftInput } from '@shared/schemas/lift-input';
import type { UnitSystem } from '@shared/schemas/common';
import type { PackageDetail } from '@shared/schemas/packages';
import { isApiError, type FieldError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import { StatusBadge } from '@/components/ui/status-badge';
import { draftInputs, prune } from '../../lib/prune';
import { labelOfPath, STEPS, stepOfPath, type StepId } from '@/lib/lift-steps';
import { useDraftAutosave } from '../../hooks/use-draft-autosave';
import { useSubmitPackage } from '../../api/submit-package';
import { LiftField } from './lift-field';
import { ChartRowsEditor } from './chart-rows-editor';
import { LiveCheckPanel } from './live-check-panel';
import { DocumentsStep } from './documents-step';
import { ConflictChoice, SaveIndicator } from './save-indicator';
import { errorPaths, IssuesContext } from './field-errors';

const zod = zodResolver(LiftInput);

/** The schema judges the lift as it would be sent: empty fields and groups left out. */
const liftResolver: Resolver<FieldValues> = (values, context, options) =>
  (zod as unknown as Resolver<FieldValues>)((prune(values) ?? {}) as FieldValues, context, options);

type Problem = { step: StepId; label: string; message: string };

export function SubmissionEditor({ detail, system }: { detail: PackageDetail; system: UnitSystem }) {
  const navigate = useNavigate();
  const [params, setParams] = useSearchParams();
  const packageId = detail.package.id;
  const stepParam = params.get('step');
  const step: StepId = STEPS.some((s) => s.id === stepParam) ? (stepParam as StepId) : 'crane';

  const form = useForm<FieldValues>({
    resolver: liftResolver,
    mode: 'onTouched',
    defaultValues: detail.current.inputs as FieldValues,
  });
  const { control, reset, trigger, setError, formState } = form;
  const values = useWatch({ control });

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
      reset(fresh.current.inputs as FieldValues);
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

  const [showAll, setShowAll] = useState(false);
  const issues = useMemo(() => {
    const byPath = new Map<string, string>();
    const parsed = LiftInput.safeParse(prune(values) ?? {});
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const path = issue.path.map(String).join('.');
        if (!byPath.has(path)) byPath.set(path, issue.message);
      }
    }
    return { byPath, showAll };
  }, [values, showAll]);
  const [serverProblems, setServerProblems] = useState<Problem[]>([]);
  const [planMissing, setPlanMissing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [submitMessage, setSubmitMessage] = useState<string | null>(null);
  const submit = useSubmitPackage();

  const errorSteps = useMemo(() => {
    const steps = new Set<StepId>();
    for (const path of errorPaths(formState.errors)) steps.add(stepOfPath(path));
    for (const path of issues.byPath.keys()) {
      if (issues.showAll || isTouched(formState.touchedFields, path)) steps.add(stepOfPath(path));
    }
    for (const problem of serverProblems) steps.add(problem.step);
    if (planMissing) steps.add('documents');
    return steps;
  }, [formState, serverProblems, planMissing, issues]);

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

  async function startSubmit() {
    setSubmitMessage(null);
    setShowAll(true);
    const valid = await trigger();
    const hasPlan = detail.current.files.some((file) => file.kind === 'lift_plan');
    setPlanMissing(!hasPlan);
    if (!valid || !hasPlan) {
      setSubmitMessage(
        !valid
          ? 'Some fields need attention before this revision can be submitted. The steps marked ✕ have errors.'
          : 'Add the lift plan PDF before submitting.',
      );
      return;
    }
    setConfirming(true);
  }

  async function confirmSubmit() {
    setSubmitMessage(null);
    const saved = await autosave.flush();
    if (!saved) {
      setConfirming(false);
      setSubmitMessage(
        'The latest changes could not be saved, so the revision was not submitted. Save first, then submit.',
      );
      return;
    }
    submit.mutate(packageId, {
      onSuccess: () => navigate(`/packages/${packageId}`),
      onError: (error) => {
        setConfirming(false);
        if (!isApiError(error)) {
          setSubmitMessage('The revision could not be submitted. Try again.');
          return;
        }
        if (error.code === 'lift_plan_missing') {
          setPlanMissing(true);
          setSubmitMessage(error.message || 'Add the lift plan PDF before submitting.');
          return;
        }
        if (error.fields.length > 0) {
          setServerProblems(mapFieldErrors(error.fields));
          for (const field of error.fields) {
            const path = field.path.replace(/^inputs\./, '');
            if (path && !['title', 'siteId', 'plannedLiftDate'].includes(path)) {
              setError(path, { type: 'server', message: field.message });
            }
          }
          setSubmitMessage(
            `The server found ${error.fields.length} ${error.fields.length === 1 ? 'problem' : 'problems'} in the lift data. The steps marked ✕ have errors.`,
          );
          return;
        }
        setSubmitMessage(error.message);
      },
    });
  }

  const current = STEPS.find((s) => s.id === step) ?? STEPS[0];
  const index = STEPS.indexOf(current);
  const live = values as Record<string, unknown>;

  return (
    <FormProvider {...form}>
      <IssuesContext.Provider value={issues}>
        <header className="mb-3 flex flex-wrap items-end justify-between gap-3 border-b-2 border-ink pb-2.5">
          <div className="min-w-0">
            <p className="font-mono text-[13px] font-bold text-ink-soft">
              {detail.package.reference} · revision {detail.current.number} · {detail.package.site.name}
            </p>
            <h1 className="truncate text-[22px] font-black leading-tight">{title || detail.package.title}</h1>
          </div>
          <div className="flex items-center gap-3">
            <StatusBadge status={detail.package.status} />
            <SaveIndicator state={autosave.state} onRetry={() => void autosave.retry()} />
            <Link
              to={`/packages/${packageId}`}
              className="text-[13px] font-bold text-verdigris underline underline-offset-2"
            >
              Package page
            </Link>
          </div>
        </header>

        {autosave.state.kind === 'conflict' && (
          <ConflictChoice
            onReload={() => void autosave.reloadSaved()}
            onKeepMine={() => void autosave.keepMine()}
          />
        )}
        {autosave.state.kind === 'frozen' && (
          <div
            role="alert"
            className="mb-3 border border-rule border-l-4 border-l-ink bg-sheet px-4 py-3 text-[13px]"
          >
            <strong>This revision has been submitted and can no longer change.</strong> Your last edits here
            were not saved.{' '}
            <Link to={`/packages/${packageId}`} className="font-bold text-verdigris underline">
              Open the package
            </Link>
            .
          </div>
        )}
        {autosave.state.kind === 'error' && (
          <div
            role="alert"
            className="mb-3 border border-failed-edge border-l-4 bg-failed-tint px-4 py-2 text-[13px]"
          >
            <strong className="text-failed-ink">Not saved.</strong> {autosave.state.message} Your changes stay
            in this tab; use Retry beside the save state.
          </div>
        )}

        <div className="grid items-start gap-4 lg:grid-cols-[12.5rem_minmax(0,1fr)] wide:grid-cols-[12.5rem_minmax(0,1fr)_22rem]">
          <nav aria-label="Steps" className="lg:sticky lg:top-4">
            <ol className="flex flex-col border border-rule bg-sheet">
              {STEPS.map((s, i) => {
                const active = s.id === step;
                const bad = errorSteps.has(s.id);
                return (
                  <li key={s.id}>
                    <button
                      type="button"
                      onClick={() => goTo(s.id)}
                      aria-current={active ? 'step' : undefined}
                      className={`flex w-full items-center gap-2 border-l-4 px-2.5 py-2 text-left text-[13.5px] ${
                        active
                          ? 'border-ink bg-sheet-alt font-black'
                          : 'border-transparent font-bold hover:bg-sheet-alt'
                      }`}
                    >
                      <span className="w-4 tabular text-ink-soft">{i + 1}</span>
                      <span className="flex-1">{s.title}</span>
                      {bad && (
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

          <section aria-labelledby="step-title" className="min-w-0 border border-rule bg-sheet px-4 py-3">
            <h2 id="step-title" className="mb-3 text-[17px] font-black">
              {index + 1}. {current.title}
            </h2>
            {current.groups
              .filter((group) => !group.when || group.when(live))
              .map((group) => (
                <fieldset key={group.title} className="mb-4 border-t border-rule pt-2">
                  <legend className="pr-2 text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
                    {group.title}
                  </legend>
                  {group.note && <p className="mb-2 text-[12.5px] text-ink-soft">{group.note}</p>}
                  <div className="grid grid-cols-[repeat(auto-fill,minmax(13.5rem,1fr))] gap-x-4 gap-y-3">
                    {group.fields.map((def) => (
                      <LiftField key={def.path} def={def} system={system} />
                    ))}
                  </div>
                </fieldset>
              ))}
            {step === 'chart' && <ChartRowsEditor system={system} />}
            {step === 'documents' && (
              <DocumentsStep detail={detail} onFilesChanged={autosave.adopt} planMissing={planMissing} />
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
                problems={[
                  ...new Set([
                    ...errorPaths(formState.errors),
                    ...[...issues.byPath.keys()].filter(
                      (path) => issues.showAll || isTouched(formState.touchedFields, path),
                    ),
                  ]),
                ].map((path) => ({ step: stepOfPath(path), label: labelOfPath(path), message: '' }))}
                planMissing={planMissing}
                revision={detail.current.number}
                onGoTo={goTo}
              />
            )}

            {submitMessage && (
              <p
                role="alert"
                className="mt-3 border-l-4 border-failed-ink bg-failed-tint px-3 py-2 text-[13px] font-bold text-failed-ink"
              >
                {submitMessage}
              </p>
            )}
            {confirming ? (
              <div
                role="alertdialog"
                aria-labelledby="confirm-title"
                className="mt-3 border-2 border-ink bg-sheet-alt px-4 py-3"
              >
                <h3 id="confirm-title" className="text-[15px] font-black">
                  Submit revision {detail.current.number}?
                </h3>
                <p className="mt-1 text-[13px]">
                  Submitting freezes this revision: its lift data and files can no longer change. The
                  independent check runs and the package goes to the site’s coordinator. Changes after that
                  need a new revision.
                </p>
                <div className="mt-2 flex gap-2">
                  <Button variant="primary" onClick={() => void confirmSubmit()} disabled={submit.isPending}>
                    {submit.isPending && <Spinner />}
                    {submit.isPending ? 'Submitting…' : `Submit and freeze revision ${detail.current.number}`}
                  </Button>
                  <Button onClick={() => setConfirming(false)} disabled={submit.isPending}>
                    Keep editing
                  </Button>
                </div>
              </div>
            ) : (
              <div className="mt-4 flex flex-wrap items-center justify-between gap-2 border-t border-rule pt-3">
                <div className="flex gap-2">
                  {index > 0 && (
                    <Button onClick={() => goTo(STEPS[index - 1].id)}>‹ {STEPS[index - 1].title}</Button>
                  )}
                  {index < STEPS.length - 1 && (
                    <Button onClick={() => goTo(STEPS[index + 1].id)}>{STEPS[index + 1].title} ›</Button>
                  )}
                </div>
                <Button variant="primary" onClick={() => void startSubmit()}>
                  Submit revision {detail.current.number}…
                </Button>
              </div>
            )}
          </section>

          <div className="lg:col-start-2 wide:sticky wide:top-4 wide:col-start-3 wide:row-start-1">
            <LiveCheckPanel values={values} system={system} />
          </div>
        </div>
      </IssuesContext.Provider>
    </FormProvider>
  );
}

/** A touched field, or any field under a touched group ('crane.upperWorks' touched covers its weight). */
function isTouched(touched: unknown, path: string): boolean {
  const parts = path.split('.');
  let node: unknown = touched;
  for (const part of parts) {
    if (node === true) return true;
    if (!node || typeof node !== 'object') return false;
    node = (node as Record<string, unknown>)[part];
  }
  return Boolean(node);
}

function mapFieldErrors(fields: FieldError[]): Problem[] {
  return fields.map((field) => ({
    step: stepOfPath(field.path),
    label: labelOfPath(field.path),
    message: field.message,
  }));
}

function ReviewStep({
  title,
  onTitle,
  plannedLiftDate,
  onPlannedLiftDate,
  problems,
  planMissing,
  revision,
  onGoTo,
}: {
  title: string;
  onTitle: (value: string) => void;
  plannedLiftDate: string;
  onPlannedLiftDate: (value: string) => void;
  problems: Problem[];
  planMissing: boolean;
  revision: number;
  onGoTo: (step: StepId) => void;
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

// A site's review policy, limit by limit: the default with where it comes from, and the
// site's own value where it has one. Typing a value makes an override; "Use default"
// empties it, and the key leaves the overrides sent. Saving records a new policy version;
// check runs from then on use it, and returns already issued keep the policy they used.
import { useForm } from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import type { z } from 'zod';
import { POLICY_DEFAULTS } from '@shared/schemas/site-policy';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { FormAlert, inputClasses } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/page-loading';
import { useSaveSitePolicy, type PolicyResponse } from '../api/site-policy';
import {
  formatPolicyValue,
  POLICY_FIELDS,
  PolicyForm,
  storedValue,
  toFormValues,
  type PolicyField,
  type PolicyFieldName,
  type PolicyFormValues,
} from '../lib/policy-fields';

const SOURCE_KINDS: Record<string, { label: string; className: string }> = {
  standard: { label: 'Standard', className: 'border-ready-edge bg-ready-tint text-ready-ink' },
  common_practice: { label: 'Common practice', className: 'border-draft-edge bg-draft-tint text-draft-ink' },
  from_memory: {
    label: 'Not yet checked',
    className: 'border-caution-ink/40 bg-caution-tint text-caution-ink',
  },
};

function defaultOf(policy: PolicyResponse, field: PolicyField) {
  const known = POLICY_DEFAULTS[field.key];
  const sent = policy.defaults[field.key];
  const value = sent?.value ?? known.value;
  return {
    value:
      field.sub && value && typeof value === 'object' ? (value as Record<string, unknown>)[field.sub] : value,
    label: field.label ?? sent?.label ?? known.label,
    source: sent?.source ?? known.source,
  };
}

function SourceNote({ kind, text }: { kind: string; text: string }) {
  const style = SOURCE_KINDS[kind] ?? SOURCE_KINDS.common_practice!;
  return (
    <span className="flex flex-col items-start gap-0.5">
      <span className={`rounded-sm border px-1.5 text-[11.5px] font-bold leading-[18px] ${style.className}`}>
        {style.label}
      </span>
      <span className="text-[12.5px] leading-snug text-ink-soft">{text}</span>
    </span>
  );
}

/** Server paths name the overrides object ("overrides.minStabilityRatio"); form fields do not. */
function formFieldOf(path: string): PolicyFieldName | null {
  const bare = path.replace(/^overrides\./, '');
  return POLICY_FIELDS.some((field) => field.name === bare) ? (bare as PolicyFieldName) : null;
}

export function PolicyEditor({ siteId, policy }: { siteId: string; policy: PolicyResponse }) {
  const save = useSaveSitePolicy(siteId);
  const {
    register,
    handleSubmit,
    setValue,
    setError,
    reset,
    watch,
    formState: { errors, isDirty },
  } = useForm<PolicyFormValues, unknown, z.output<typeof PolicyForm>>({
    resolver: zodResolver(PolicyForm),
    values: toFormValues(policy.overrides),
  });
  // Each row shows whether it is the default or the site's own value as the admin types.
  // eslint-disable-next-line react-hooks/incompatible-library
  const current = watch();

  const onSubmit = handleSubmit((overrides) => {
    save.mutate(overrides, {
      onSuccess: (saved) => reset(toFormValues(saved.overrides)),
      onError: (error) => {
        if (!isApiError(error)) return;
        for (const field of error.fields) {
          const name = formFieldOf(field.path);
          if (name) setError(name, { type: 'server', message: field.message });
        }
      },
    });
  });

  const failure = save.error;
  const alert =
    failure && (!isApiError(failure) || !failure.fields.some((field) => formFieldOf(field.path)))
      ? failure.message
      : null;

  const typedText = (field: PolicyField) =>
    (field.sub ? current.tandemMarginPct?.[field.sub] : current[field.key as keyof PolicyFormValues]) as
      string | undefined;
  const overriddenCount = POLICY_FIELDS.filter((field) => (typedText(field) ?? '').trim() !== '').length;

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Review policy" className="flex flex-col gap-3">
      {alert && <FormAlert>{alert}</FormAlert>}
      <div className="overflow-x-auto border border-rule bg-sheet">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Limits of the review policy</caption>
          <thead className="bg-sheet-alt text-left text-[12.5px] uppercase tracking-[0.06em] text-ink-soft">
            <tr className="border-b border-rule">
              <th scope="col" className="w-[30%] px-3 py-2 font-bold">
                Limit
              </th>
              <th scope="col" className="w-[14%] px-3 py-2 font-bold">
                Default
              </th>
              <th scope="col" className="w-[28%] px-3 py-2 font-bold">
                Where the default comes from
              </th>
              <th scope="col" className="px-3 py-2 font-bold">
                This site
              </th>
            </tr>
          </thead>
          <tbody>
            {POLICY_FIELDS.map((field) => {
              const fallback = defaultOf(policy, field);
              const typed = (typedText(field) ?? '').trim();
              const overridden = typed !== '';
              const error = field.sub
                ? errors.tandemMarginPct?.[field.sub]?.message
                : errors[field.key as Exclude<keyof PolicyFormValues, 'tandemMarginPct'>]?.message;
              const inputId = `policy-${field.name.replace('.', '-')}`;
              const effective = storedValue(policy.effective, field);
              return (
                <tr
                  key={field.name}
                  data-testid={`policy-row-${field.name}`}
                  className={`border-b border-rule align-top last:border-b-0 ${overridden ? 'bg-verdigris-tint/45' : ''}`}
                >
                  <th scope="row" className="px-3 py-2.5 text-left font-normal">
                    <label htmlFor={inputId} className="font-bold">
                      {fallback.label}
                    </label>
                  </th>
                  <td className="tabular px-3 py-2.5" data-testid="policy-default">
                    {formatPolicyValue(fallback.value, field)}
                  </td>
                  <td className="px-3 py-2.5">
                    <SourceNote kind={fallback.source.kind} text={fallback.source.text} />
                  </td>
                  <td className="px-3 py-2.5">
                    <div className="flex items-start gap-2">
                      <span className="relative inline-flex shrink-0">
                        <input
                          id={inputId}
                          type="text"
                          inputMode="decimal"
                          autoComplete="off"
                          placeholder="Default"
                          aria-invalid={error ? true : undefined}
                          aria-describedby={error ? `${inputId}-error` : `${inputId}-state`}
                          className={`${inputClasses} w-[112px] pr-10 text-right tabular`}
                          {...register(field.name)}
                        />
                        <span
                          aria-hidden="true"
                          className="pointer-events-none absolute right-2 top-1/2 -translate-y-1/2 text-[12.5px] text-ink-soft"
                        >
                          {field.unit}
                        </span>
                      </span>
                      <span className="flex min-w-0 flex-col items-start">
                        <span
                          id={`${inputId}-state`}
                          className={`text-[12.5px] font-bold leading-5 ${overridden ? 'text-verdigris' : 'text-ink-soft'}`}
                        >
                          {overridden ? 'Site value' : 'Uses the default'}
                        </span>
                        {overridden && (
                          <button
                            type="button"
                            aria-label={`Use the default for ${fallback.label}`}
                            onClick={() =>
                              setValue(field.name, '', { shouldDirty: true, shouldValidate: true })
                            }
                            className="text-[12.5px] font-bold text-verdigris underline decoration-1 underline-offset-2 hover:text-verdigris-deep"
                          >
                            Use the default
                          </button>
                        )}
                      </span>
                    </div>
                    {error && (
                      <p id={`${inputId}-error`} className="mt-1 text-[13px] font-bold text-failed-ink">
                        {error}
                      </p>
                    )}
                    {!error && !isDirty && overridden && effective !== undefined && (
                      <p className="mt-1 text-[12px] text-ink-soft">
                        In force: {formatPolicyValue(effective, field)}
                      </p>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>

      <div className="sticky bottom-0 flex flex-wrap items-center justify-between gap-3 border border-rule border-t-2 border-t-ink bg-sheet px-4 py-2.5">
        <p className="text-[13px] text-ink-soft" aria-live="polite">
          {overriddenCount === 0
            ? 'Every limit uses its default.'
            : `${overriddenCount} ${overriddenCount === 1 ? 'limit differs' : 'limits differ'} from the default.`}{' '}
          {isDirty && <strong className="text-ink">Unsaved changes.</strong>}
        </p>
        <div className="flex items-center gap-2">
          <Button disabled={!isDirty || save.isPending} onClick={() => reset(toFormValues(policy.overrides))}>
            Discard changes
          </Button>
          <Button type="submit" variant="primary" disabled={!isDirty || save.isPending}>
            {save.isPending && <Spinner />}
            {save.isPending ? 'Saving…' : 'Save policy'}
          </Button>
        </div>
      </div>
      {save.isSuccess && !isDirty && (
        <p role="status" className="text-[13px] font-bold text-pass-ink">
          Saved as policy version {save.data.policyVersion}. Check runs from now on use it.
        </p>
      )}
    </form>
  );
}

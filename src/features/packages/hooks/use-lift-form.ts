// The submission form's values, typed from the shared lift-input schema: a draft of the
// schema's input (every field may still be empty), judged by the schema as it would be sent
// (empty fields and groups left out first). The field catalogue (shared/catalogue/lift-fields) names fields by
// string path; liftPath() is the one place such a path becomes a form path, and a client test
// checks every catalogue path against the schema.
import { useMemo } from 'react';
import {
  useForm,
  useFormContext,
  useWatch,
  type DeepPartial,
  type FieldArrayPath,
  type FieldName,
  type FieldPath,
  type Resolver,
} from 'react-hook-form';
import { readableResolver as zodResolver } from '@/lib/readable-resolver';
import { readableIssue } from '@shared/catalogue/readable-issue';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import type { PackageDetail } from '@shared/schemas/packages';
import { upgradeLiftInput } from '@shared/engineering/upgrade';
import { prune } from '../lib/prune';

export type LiftFormValues = DeepPartial<LiftInputRaw>;

/**
 * The schema's issues for the lift as it stands, by path ('crane.boomAngle.value'). The
 * form shows a field's issue once the field has been touched, or every issue after the
 * person tried to submit, beside react-hook-form's own errors (server errors, submit).
 */
export type Issues = { byPath: Map<string, string>; showAll: boolean };
export type LiftFieldPath = FieldPath<LiftFormValues>;

export function liftPath(path: string): LiftFieldPath {
  return path as LiftFieldPath;
}

/** The same for a catalogue field that is a list of rows. */
export function liftListPath(path: string): FieldArrayPath<LiftFormValues> {
  return path as FieldArrayPath<LiftFormValues>;
}

const zod = zodResolver(LiftInput);

/** The schema judges the lift as it would be sent: empty fields and groups left out. */
const liftResolver: Resolver<LiftFormValues, unknown, LiftInput> = (values, context, options) =>
  zod((prune(values) ?? {}) as LiftInputRaw, context, {
    ...options,
    // Field names are paths, the same for the draft as for the lift it becomes.
    names: options.names as FieldName<LiftInputRaw>[] | undefined,
  });

/** A saved draft's inputs as form values: stored drafts are partial lifts of the same shape. */
export function formValues(inputs: PackageDetail['current']['inputs']): LiftFormValues {
  const draft = inputs as LiftFormValues & { tandem?: { cranes?: unknown[] } };
  // A version 1 draft with several cranes (`tandem`) opens as version 2 (`multiCrane`), through the
  // same converter the engine applies to stored inputs; a draft too incomplete to convert stays.
  if (draft?.tandem?.cranes?.length) {
    try {
      return upgradeLiftInput(draft as unknown as LiftInput) as unknown as LiftFormValues;
    } catch {
      return draft;
    }
  }
  return draft;
}

export function useLiftForm(detail: PackageDetail) {
  return useForm<LiftFormValues, unknown, LiftInput>({
    resolver: liftResolver,
    mode: 'onTouched',
    defaultValues: formValues(detail.current.inputs),
  });
}

export function useLiftFormContext() {
  return useFormContext<LiftFormValues, unknown, LiftInput>();
}

export function useLiftIssues(values: LiftFormValues, showAll: boolean): Issues {
  return useMemo(() => {
    const byPath = new Map<string, string>();
    const parsed = LiftInput.safeParse(prune(values) ?? {});
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const path = issue.path.map(String).join('.');
        if (!byPath.has(path)) byPath.set(path, readableIssue(path, issue.message));
      }
    }
    return { byPath, showAll };
  }, [values, showAll]);
}

export function useLiftValues(control: ReturnType<typeof useLiftForm>['control']): LiftFormValues {
  return useWatch({ control });
}

/** A touched field, or any field under a touched group ('crane.upperWorks' touched covers its weight). */
export function isTouched(touched: unknown, path: string): boolean {
  let node: unknown = touched;
  for (const part of path.split('.')) {
    if (node === true) return true;
    if (!node || typeof node !== 'object') return false;
    node = (node as Record<string, unknown>)[part];
  }
  return Boolean(node);
}

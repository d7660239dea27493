// The shapes of the field catalogue (lift-fields.ts): a field, a group of fields shown together,
// and a step of the submission editor; q() writes a quantity field.
import type { QuantityKind } from '@shared/vocabulary/units';

export type FieldDef =
  | { kind: 'quantity'; path: string; label: string; q: QuantityKind; hint?: string }
  | { kind: 'number'; path: string; label: string; integer?: boolean; suffix?: string; hint?: string }
  | {
      kind: 'select';
      path: string;
      label: string;
      options: readonly (readonly [string, string])[];
      hint?: string;
    }
  | { kind: 'text'; path: string; label: string; hint?: string }
  | { kind: 'checkbox'; path: string; label: string; hint?: string }
  | { kind: 'list'; path: string; label: string; columns: FieldDef[]; addLabel: string; hint?: string };

export type FieldGroup = {
  title: string;
  note?: string;
  fields: FieldDef[];
  /** Shown only when this returns true for the form's values (e.g. outriggers for a mobile crane). */
  when?: (values: Record<string, unknown>) => boolean;
};

export type StepId =
  | 'crane'
  | 'chart'
  | 'load'
  | 'reeving'
  | 'ground'
  | 'hazards'
  | 'cranes'
  | 'stated'
  | 'documents'
  | 'review';

export type Step = { id: StepId; title: string; groups: FieldGroup[] };

/** A quantity field (a number with its unit of the given kind). */
export const q = (path: string, label: string, kind: QuantityKind, hint?: string): FieldDef => ({
  kind: 'quantity',
  path,
  label,
  q: kind,
  hint,
});

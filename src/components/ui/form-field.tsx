// One labelled form field: the label, the control, a hint and the error under it. The
// control gets its id, aria-invalid and aria-describedby from here so every form reads the
// same way to a screen reader.
import { cloneElement, type ReactElement } from 'react';

export const inputClasses =
  'h-9 w-full rounded-[3px] border border-rule-strong bg-sheet px-2.5 text-[14px] text-ink placeholder:text-ink-soft/80 aria-[invalid=true]:border-2 aria-[invalid=true]:border-failed-ink';

export const selectClasses =
  'h-9 w-full rounded-[3px] border border-rule-strong bg-sheet px-2 text-[14px] text-ink aria-[invalid=true]:border-2 aria-[invalid=true]:border-failed-ink';

type ControlProps = {
  id?: string;
  'aria-invalid'?: boolean;
  'aria-describedby'?: string;
};

export function FormField({
  id,
  label,
  hint,
  error,
  className = '',
  children,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  className?: string;
  children: ReactElement<ControlProps>;
}) {
  const described = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ');
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-[13.5px] font-bold">
        {label}
      </label>
      {cloneElement(children, {
        id,
        'aria-invalid': error ? true : undefined,
        'aria-describedby': described || undefined,
      })}
      {hint && (
        <p id={`${id}-hint`} className="text-[12.5px] text-ink-soft">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-[13px] font-bold text-failed-ink">
          {error}
        </p>
      )}
    </div>
  );
}

/** A message for the whole form (not one field), e.g. a server refusal without field errors. */
export function FormAlert({ children }: { children: string }) {
  return (
    <div
      role="alert"
      className="border-l-4 border-failed-ink bg-failed-tint px-3 py-2 text-sm font-bold text-failed-ink"
    >
      {children}
    </div>
  );
}

// A number typed as text: the person's own text stays in the box ("12.50", "1e3"), the
// form gets a number, undefined when the box is empty, and NaN for text that is not a
// number (the schema then says "must be a finite number").
import { useState, type InputHTMLAttributes } from 'react';

export function parseNumber(text: string): number | undefined {
  const trimmed = text.trim().replace(/\s/g, '');
  if (trimmed === '') return undefined;
  return Number(trimmed.replace(/^−/, '-'));
}

function sameNumber(a: number | undefined, b: number | undefined): boolean {
  return a === b || (Number.isNaN(a) && Number.isNaN(b));
}

export function NumberText({
  value,
  onValue,
  className = '',
  ...props
}: Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange' | 'type'> & {
  value: number | undefined;
  onValue: (value: number | undefined) => void;
}) {
  const [text, setText] = useState(value === undefined || Number.isNaN(value) ? '' : String(value));
  const [seen, setSeen] = useState(value);
  // The value changed from outside (a paste, a reload of the saved draft): show it.
  if (!sameNumber(seen, value)) {
    setSeen(value);
    if (!sameNumber(parseNumber(text), value))
      setText(value === undefined || Number.isNaN(value) ? '' : String(value));
  }
  return (
    <input
      type="text"
      inputMode="decimal"
      autoComplete="off"
      value={text}
      onChange={(event) => {
        const next = parseNumber(event.target.value);
        setText(event.target.value);
        setSeen(next);
        onValue(next);
      }}
      className={`h-8 min-w-0 rounded-[3px] border border-rule-strong bg-sheet px-2 text-right text-[14px] tabular text-ink aria-[invalid=true]:border-2 aria-[invalid=true]:border-failed-ink ${className}`}
      {...props}
    />
  );
}

// A small "Copy" button that says when it has copied (or that it could not).
import { useState } from 'react';

export function CopyButton({ text, label }: { text: string; label: string }) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  return (
    <button
      type="button"
      aria-label={label}
      onClick={() => {
        navigator.clipboard
          ?.writeText(text)
          .then(() => setState('copied'))
          .catch(() => setState('failed'));
        if (!navigator.clipboard) setState('failed');
      }}
      className="rounded-[3px] border border-rule-strong px-1.5 text-[11.5px] font-bold text-ink-soft hover:border-ink hover:text-ink"
    >
      <span aria-live="polite">
        {state === 'copied' ? 'Copied' : state === 'failed' ? 'Select to copy' : 'Copy'}
      </span>
    </button>
  );
}

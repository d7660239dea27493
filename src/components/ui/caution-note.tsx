// The standing caution shown on every signed-in page and the sign-in page.
import { STANDING_CAUTION } from '@shared/vocabulary/cautions';

export function CautionNote({ className = '' }: { className?: string }) {
  return (
    <footer
      role="contentinfo"
      className={`flex items-start gap-2 border-t border-rule px-6 py-3 text-[12.5px] leading-snug text-ink-soft ${className}`}
    >
      <svg className="mt-px size-4 shrink-0" viewBox="0 0 16 16" aria-hidden="true" fill="none">
        <path d="M8 1.5 L14.5 13.5 H1.5 Z" stroke="currentColor" strokeWidth="1.4" strokeLinejoin="round" />
        <path d="M8 6 V9.5" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" />
        <circle cx="8" cy="11.5" r="0.8" fill="currentColor" />
      </svg>
      <p>
        <strong className="font-bold text-ink">Caution.</strong> {STANDING_CAUTION}
      </p>
    </footer>
  );
}

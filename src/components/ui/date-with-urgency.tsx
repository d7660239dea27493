// "14 Mar 2027 · in 3 days": a planned date with how near it is, late dates marked by
// word and a glyph as well as colour.
import { formatDate, liftUrgency } from '@/lib/format';

const TONES = {
  late: 'text-late font-bold',
  soon: 'text-soon font-bold',
  later: 'text-ink-soft',
  past: 'text-ink-soft',
} as const;

export function DateWithUrgency({ value, settled = false }: { value: string | null; settled?: boolean }) {
  if (!value) return <span className="text-ink-soft">Not set</span>;
  const urgency = liftUrgency(value, settled);
  return (
    <span className="flex flex-col tabular">
      <time dateTime={value.slice(0, 10)} className="whitespace-nowrap">
        {formatDate(value)}
      </time>
      {urgency && (
        <span className={`whitespace-nowrap text-[12.5px] ${TONES[urgency.tone]}`}>
          {urgency.tone === 'late' && <span aria-hidden="true">▲ </span>}
          {urgency.text}
        </span>
      )}
    </span>
  );
}

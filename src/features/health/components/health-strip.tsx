// A compact line on whether the desk's database and job queue are answering.
import { useHealth } from '../api/get-health';

function Item({ label, ok }: { label: string; ok: boolean | null }) {
  const text = ok === null ? 'unknown' : ok ? 'answering' : 'down';
  const tone = ok === null ? 'text-ink-soft' : ok ? 'text-pass-ink' : 'text-fail-ink';
  return (
    <span className={`inline-flex items-center gap-1.5 text-[13px] ${tone}`}>
      <svg className="size-3" viewBox="0 0 12 12" aria-hidden="true">
        {ok ? (
          <circle cx="6" cy="6" r="5" fill="currentColor" />
        ) : (
          <rect x="1" y="1" width="10" height="10" fill="none" stroke="currentColor" strokeWidth="2" />
        )}
      </svg>
      <span>
        <span className="font-bold text-ink">{label}</span> {text}
      </span>
    </span>
  );
}

export function HealthStrip() {
  const health = useHealth();
  const data = health.data;
  return (
    <div
      role="status"
      aria-label="Desk services"
      className="flex items-center gap-4 border border-rule bg-sheet px-3 py-1.5"
    >
      <Item label="Database" ok={data ? data.database.ok : health.isError ? false : null} />
      <Item label="Job queue" ok={data ? data.queue.ok : health.isError ? false : null} />
    </div>
  );
}

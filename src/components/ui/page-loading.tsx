// A quiet loading line for whole pages; says what is being waited for.
export function Spinner({ className = 'size-4' }: { className?: string }) {
  return (
    <svg className={`${className} animate-spin`} viewBox="0 0 16 16" aria-hidden="true" fill="none">
      <circle cx="8" cy="8" r="6.5" stroke="currentColor" strokeOpacity="0.25" strokeWidth="2" />
      <path d="M8 1.5 A6.5 6.5 0 0 1 14.5 8" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}

export function PageLoading({ label }: { label: string }) {
  return (
    <div role="status" className="flex min-h-[40vh] items-center justify-center gap-2 text-ink-soft">
      <Spinner />
      <span>{label}…</span>
    </div>
  );
}

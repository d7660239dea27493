// The Counterpoise mark: a balance beam with the load on one arm and the counterweight
// on the other — the moment balance every lift check comes down to.
export function LogoMark({ className = 'size-7' }: { className?: string }) {
  return (
    <svg className={className} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="6" fill="currentColor" fillOpacity="0.08" />
      <path
        d="M16 7 V24 M5 12 H27 M10 24 H22"
        stroke="currentColor"
        strokeWidth="2.4"
        strokeLinecap="round"
      />
      <rect x="4" y="14" width="6" height="5" rx="1" fill="#e2b34a" />
      <path d="M24 12 V18" stroke="#e2b34a" strokeWidth="2" strokeLinecap="round" />
      <circle cx="24" cy="20" r="2" fill="#e2b34a" />
    </svg>
  );
}

export function Wordmark({ className = '' }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 ${className}`}>
      <LogoMark />
      <span className="text-[17px] font-black tracking-[0.02em]">Counterpoise</span>
    </span>
  );
}

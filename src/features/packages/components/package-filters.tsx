// Search and status filter above a package list. Typing updates the URL after a short
// pause; "/" anywhere on the page jumps to the search box.
import { useEffect, useRef, useState } from 'react';
import { PACKAGE_STATUSES, PACKAGE_STATUS_LABELS, type PackageStatus } from '@shared/schemas/common';

export function PackageFilters({
  q,
  status,
  onSearch,
  onStatus,
  statuses = PACKAGE_STATUSES,
}: {
  q: string | undefined;
  status: PackageStatus | undefined;
  onSearch: (q: string) => void;
  onStatus: (status: PackageStatus | undefined) => void;
  statuses?: readonly PackageStatus[];
}) {
  const [text, setText] = useState(q ?? '');
  const inputRef = useRef<HTMLInputElement>(null);
  const lastSent = useRef(q ?? '');

  // When the URL changes from elsewhere (back button, a status tile), show its search.
  useEffect(() => {
    if ((q ?? '') !== lastSent.current) {
      lastSent.current = q ?? '';
      setText(q ?? '');
    }
  }, [q]);

  useEffect(() => {
    const trimmed = text.trim();
    if (trimmed === lastSent.current) return;
    const timer = window.setTimeout(() => {
      lastSent.current = trimmed;
      onSearch(trimmed);
    }, 300);
    return () => window.clearTimeout(timer);
  }, [text, onSearch]);

  useEffect(() => {
    function onKey(event: KeyboardEvent) {
      const target = event.target as HTMLElement | null;
      const typing =
        target && (target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName));
      if (event.key === '/' && !typing && !event.ctrlKey && !event.metaKey && !event.altKey) {
        event.preventDefault();
        inputRef.current?.focus();
      }
    }
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);

  return (
    <form
      role="search"
      className="mb-3 flex flex-wrap items-end gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        lastSent.current = text.trim();
        onSearch(text.trim());
      }}
    >
      <label className="flex min-w-[18rem] flex-1 flex-col gap-1 text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
        Search
        <span className="relative">
          <svg
            className="pointer-events-none absolute left-2.5 top-1/2 size-4 -translate-y-1/2 text-ink-soft"
            viewBox="0 0 16 16"
            aria-hidden="true"
            fill="none"
            stroke="currentColor"
            strokeWidth="1.6"
          >
            <circle cx="6.8" cy="6.8" r="4.6" />
            <path d="M10.3 10.3 L14 14" strokeLinecap="round" />
          </svg>
          <input
            ref={inputRef}
            type="search"
            value={text}
            maxLength={100}
            onChange={(event) => setText(event.target.value)}
            placeholder="Reference or lift title"
            className="h-9 w-full rounded-[3px] border border-rule-strong bg-sheet pl-8 pr-10 text-sm font-normal normal-case tracking-normal text-ink placeholder:text-ink-soft"
          />
          <kbd className="pointer-events-none absolute right-2 top-1/2 -translate-y-1/2 rounded-sm border border-rule-strong px-1.5 font-mono text-[11px] font-normal text-ink-soft">
            /
          </kbd>
        </span>
      </label>
      <label className="flex flex-col gap-1 text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
        Status
        <select
          value={status ?? ''}
          onChange={(event) => onStatus((event.target.value || undefined) as PackageStatus | undefined)}
          className="h-9 min-w-[12rem] rounded-[3px] border border-rule-strong bg-sheet px-2 text-sm font-normal normal-case tracking-normal text-ink"
        >
          <option value="">Every status</option>
          {statuses.map((value) => (
            <option key={value} value={value}>
              {PACKAGE_STATUS_LABELS[value]}
            </option>
          ))}
        </select>
      </label>
    </form>
  );
}

// The queue's narrower filters: site, contractor, engineer (or nobody yet), critical
// lifts, open discrepancies, lifts coming up within some days and later revisions. Each
// choice goes straight into the URL; the server does the filtering.
import type { ReactNode } from 'react';
import type { PackageListFilters } from '@/lib/query-keys';
import { Button } from '@/components/ui/button';

export type QueueFilterChanges = Partial<{
  [K in keyof PackageListFilters]: PackageListFilters[K] | undefined;
}>;

type Option = { id: string; name: string };

export const LIFT_WITHIN_DAYS = [0, 3, 7, 14, 30] as const;
export const REVISION_MIN = [2, 3, 4] as const;

function FilterSelect({
  label,
  value,
  onChange,
  children,
  active,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  children: ReactNode;
  active: boolean;
}) {
  return (
    <label className="flex min-w-[9.5rem] flex-1 flex-col gap-1 text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">
      {label}
      <select
        value={value}
        onChange={(event) => onChange(event.target.value)}
        className={`h-8 w-full rounded-[3px] border bg-sheet px-1.5 text-[13.5px] font-normal normal-case tracking-normal text-ink ${
          active ? 'border-ink shadow-[inset_0_-2px_0_var(--color-verdigris)]' : 'border-rule-strong'
        }`}
      >
        {children}
      </select>
    </label>
  );
}

function flagValue(value: boolean | undefined): string {
  return value === undefined ? '' : String(value);
}

function toFlag(value: string): boolean | undefined {
  return value === 'true' ? true : value === 'false' ? false : undefined;
}

export function QueueFilters({
  filters,
  onChange,
  sites,
  contractors,
  engineers,
}: {
  filters: PackageListFilters;
  onChange: (changes: QueueFilterChanges) => void;
  sites: Option[] | undefined;
  contractors: Option[];
  /** Leave out to hide the engineer filter (the engineer's own list). */
  engineers?: Option[];
}) {
  const anyOn =
    filters.siteId !== undefined ||
    filters.contractorId !== undefined ||
    filters.engineerId !== undefined ||
    filters.critical !== undefined ||
    filters.discrepancies !== undefined ||
    filters.liftWithinDays !== undefined ||
    filters.revisionMin !== undefined;
  // A filter from a shared link may name a contractor this person has not seen in a row yet.
  const contractorOptions =
    filters.contractorId && !contractors.some((c) => c.id === filters.contractorId)
      ? [...contractors, { id: filters.contractorId, name: 'The contractor in the link' }]
      : contractors;

  return (
    <div
      role="group"
      aria-label="More filters"
      className="mb-3 flex flex-wrap items-end gap-x-2.5 gap-y-2 border-t border-rule pt-2.5"
    >
      <FilterSelect
        label="Site"
        value={filters.siteId ?? ''}
        active={filters.siteId !== undefined}
        onChange={(value) => onChange({ siteId: value || undefined })}
      >
        <option value="">Every site</option>
        {(sites ?? []).map((site) => (
          <option key={site.id} value={site.id}>
            {site.name}
          </option>
        ))}
        {filters.siteId && !sites?.some((s) => s.id === filters.siteId) && (
          <option value={filters.siteId}>The site in the link</option>
        )}
      </FilterSelect>
      <FilterSelect
        label="Contractor"
        value={filters.contractorId ?? ''}
        active={filters.contractorId !== undefined}
        onChange={(value) => onChange({ contractorId: value || undefined })}
      >
        <option value="">Every contractor</option>
        {contractorOptions.map((c) => (
          <option key={c.id} value={c.id}>
            {c.name}
          </option>
        ))}
      </FilterSelect>
      {engineers && (
        <FilterSelect
          label="Engineer"
          value={filters.engineerId ?? ''}
          active={filters.engineerId !== undefined}
          onChange={(value) => onChange({ engineerId: value || undefined })}
        >
          <option value="">Anyone or nobody</option>
          <option value="none">Unassigned</option>
          {engineers.map((e) => (
            <option key={e.id} value={e.id}>
              {e.name}
            </option>
          ))}
          {filters.engineerId &&
            filters.engineerId !== 'none' &&
            !engineers.some((e) => e.id === filters.engineerId) && (
              <option value={filters.engineerId}>The engineer in the link</option>
            )}
        </FilterSelect>
      )}
      <FilterSelect
        label="Critical lift"
        value={flagValue(filters.critical)}
        active={filters.critical !== undefined}
        onChange={(value) => onChange({ critical: toFlag(value) })}
      >
        <option value="">Critical or not</option>
        <option value="true">Critical only</option>
        <option value="false">Not critical</option>
      </FilterSelect>
      <FilterSelect
        label="Discrepancies"
        value={flagValue(filters.discrepancies)}
        active={filters.discrepancies !== undefined}
        onChange={(value) => onChange({ discrepancies: toFlag(value) })}
      >
        <option value="">With or without</option>
        <option value="true">Open discrepancies</option>
        <option value="false">None open</option>
      </FilterSelect>
      <FilterSelect
        label="Planned lift"
        value={filters.liftWithinDays === undefined ? '' : String(filters.liftWithinDays)}
        active={filters.liftWithinDays !== undefined}
        onChange={(value) => onChange({ liftWithinDays: value === '' ? undefined : Number(value) })}
      >
        <option value="">Any date</option>
        {LIFT_WITHIN_DAYS.map((days) => (
          <option key={days} value={days}>
            {days === 0 ? 'Today or late' : `Within ${days} days or late`}
          </option>
        ))}
        {filters.liftWithinDays !== undefined &&
          !(LIFT_WITHIN_DAYS as readonly number[]).includes(filters.liftWithinDays) && (
            <option value={filters.liftWithinDays}>Within {filters.liftWithinDays} days or late</option>
          )}
      </FilterSelect>
      <FilterSelect
        label="Revision"
        value={filters.revisionMin === undefined ? '' : String(filters.revisionMin)}
        active={filters.revisionMin !== undefined}
        onChange={(value) => onChange({ revisionMin: value === '' ? undefined : Number(value) })}
      >
        <option value="">Any revision</option>
        {REVISION_MIN.map((n) => (
          <option key={n} value={n}>
            Revision {n} or later
          </option>
        ))}
        {filters.revisionMin !== undefined &&
          !(REVISION_MIN as readonly number[]).includes(filters.revisionMin) && (
            <option value={filters.revisionMin}>Revision {filters.revisionMin} or later</option>
          )}
      </FilterSelect>
      {anyOn && (
        <Button
          size="sm"
          variant="quiet"
          className="mb-0.5"
          onClick={() =>
            onChange({
              siteId: undefined,
              contractorId: undefined,
              engineerId: undefined,
              critical: undefined,
              discrepancies: undefined,
              liftWithinDays: undefined,
              revisionMin: undefined,
            })
          }
        >
          Clear these filters
        </Button>
      )}
    </div>
  );
}

// The contractor's fleet: every crane with its configurations, searched by fleet number, make
// or model, and filtered to the configurations that rate a capacity at a planned radius.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { CRANE_TYPE_LABELS, WORKING_AREA_LABELS } from '@shared/schemas/library';
import { inputClasses, selectClasses } from '@/components/ui/form-field';
import { PageLoading } from '@/components/ui/page-loading';
import { EmptyState, ErrorPanel } from '@/components/ui/panel-message';
import { isApiError } from '@/lib/api-client';
import { useCranes } from '../api/cranes';
import type { CraneFilters } from '@/lib/query-keys';

export function useFleetFilters() {
  const [q, setQ] = useState('');
  const [radius, setRadius] = useState('');
  const [capacity, setCapacity] = useState('');
  const [radiusUnit, setRadiusUnit] = useState('m');
  const [capacityUnit, setCapacityUnit] = useState('t');
  const r = Number(radius);
  const c = Number(capacity);
  const filters: CraneFilters = {
    q: q.trim() || undefined,
    ...(radius.trim() && Number.isFinite(r) ? { radius: r, radiusUnit } : {}),
    ...(capacity.trim() && radius.trim() && Number.isFinite(c) ? { capacity: c, capacityUnit } : {}),
  };
  const controls = (
    <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Search the fleet">
      <label className="flex flex-col gap-1 text-[13px] font-bold">
        Fleet number, make or model
        <input
          className={`${inputClasses.replace('w-full', '')} w-64`}
          value={q}
          onChange={(e) => setQ(e.target.value)}
          type="search"
        />
      </label>
      <label className="flex flex-col gap-1 text-[13px] font-bold">
        Planned radius
        <span className="flex gap-1">
          <input
            className={`${inputClasses.replace('w-full', '')} w-20`}
            inputMode="decimal"
            value={radius}
            onChange={(e) => setRadius(e.target.value)}
          />
          <select
            aria-label="Radius unit"
            className={`${selectClasses.replace('w-full', '')} w-16`}
            value={radiusUnit}
            onChange={(e) => setRadiusUnit(e.target.value)}
          >
            <option value="m">m</option>
            <option value="ft">ft</option>
          </select>
        </span>
      </label>
      <label className="flex flex-col gap-1 text-[13px] font-bold">
        Needs at least
        <span className="flex gap-1">
          <input
            className={`${inputClasses.replace('w-full', '')} w-20`}
            inputMode="decimal"
            value={capacity}
            onChange={(e) => setCapacity(e.target.value)}
            disabled={!radius.trim()}
          />
          <select
            aria-label="Capacity unit"
            className={`${selectClasses.replace('w-full', '')} w-20`}
            value={capacityUnit}
            onChange={(e) => setCapacityUnit(e.target.value)}
          >
            <option value="t">t</option>
            <option value="kip">kip</option>
            <option value="lb">lb</option>
            <option value="kg">kg</option>
          </select>
        </span>
      </label>
    </div>
  );
  return { filters, controls };
}

export function FleetView() {
  const { filters, controls } = useFleetFilters();
  const cranes = useCranes(filters);
  return (
    <section aria-label="Fleet" className="flex flex-col gap-3">
      {controls}
      {cranes.isPending && <PageLoading label="Reading the fleet" />}
      {cranes.isError && (
        <ErrorPanel
          title="The fleet could not be read"
          message={isApiError(cranes.error) ? cranes.error.message : 'Try again.'}
        />
      )}
      {cranes.data && cranes.data.items.length === 0 && (
        <EmptyState
          title={
            filters.q || filters.radius !== undefined ? 'No crane matches' : 'No cranes in the library yet'
          }
        >
          {filters.q || filters.radius !== undefined
            ? 'Nothing in the fleet matches the search or rates that capacity at that radius.'
            : 'Add a crane, then its configurations with their load charts: every package can then pick them instead of retyping.'}
        </EmptyState>
      )}
      {cranes.data && cranes.data.items.length > 0 && (
        <table className="w-full border-collapse border border-rule bg-sheet text-[13.5px]">
          <caption className="sr-only">Cranes and configurations</caption>
          <thead className="bg-sheet-alt text-left">
            <tr>
              <th scope="col" className="px-3 py-1.5">
                Fleet no.
              </th>
              <th scope="col" className="px-3 py-1.5">
                Crane
              </th>
              <th scope="col" className="px-3 py-1.5">
                Configurations (current version)
              </th>
            </tr>
          </thead>
          <tbody>
            {cranes.data.items.map((c) => (
              <tr key={c.id} className="border-t border-rule align-top">
                <td className="px-3 py-2 font-bold">
                  <Link
                    to={`/library/cranes/${c.id}`}
                    className="text-verdigris underline underline-offset-2"
                  >
                    {c.fleetNumber}
                  </Link>
                </td>
                <td className="px-3 py-2">
                  {c.make} {c.model}
                  <span className="block text-[12.5px] text-ink-soft">{CRANE_TYPE_LABELS[c.type]}</span>
                </td>
                <td className="px-3 py-2">
                  {c.configurations.length === 0 ? (
                    <span className="text-ink-soft">none yet</span>
                  ) : (
                    <ul className="flex flex-col gap-0.5">
                      {c.configurations.map((k) => (
                        <li key={k.id}>
                          <Link
                            to={`/library/configurations/${k.id}`}
                            className="text-verdigris underline underline-offset-2"
                          >
                            {k.name}
                          </Link>{' '}
                          <span className="text-ink-soft">
                            v{k.current.number} · {WORKING_AREA_LABELS[k.workingArea]}
                            {k.capacityAtRadius !== null &&
                              ` · rates ${Number(k.capacityAtRadius.toPrecision(3))} ${k.capacityUnit} at that radius`}
                          </span>
                        </li>
                      ))}
                    </ul>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}

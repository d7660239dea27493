// The editor's "pick from the fleet library", once per crane slot (0 the crane of the first steps,
// 1 to 3 the other cranes of a lift with several cranes): search the fleet by fleet number or
// model, filter by capacity at the planned radius, and use a configuration's current version. That
// crane's configuration and chart then fill from it and stay read-only; "detach a copy" makes them
// editable again, and the engineer then sees the copy flagged with every changed cell.
import { useState } from 'react';
import { fillFromVersion, type LibraryFill } from '@shared/library/to-lift-input';
import { WORKING_AREA_LABELS } from '@shared/schemas/library';
import { api, isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { ErrorPanel } from '@/components/ui/panel-message';
import { VersionDetail } from '@shared/schemas/library';
import { useCranes } from '../api/cranes';
import { useLibraryUses, useRemoveLibraryUse, useSetLibraryUse } from '../api/library-uses';
import { useFleetFilters } from './fleet-view';

function Finder({
  onPick,
  busy,
  listLabel,
}: {
  onPick: (versionId: string) => void;
  busy: boolean;
  listLabel: string;
}) {
  const { filters, controls } = useFleetFilters();
  const cranes = useCranes(filters);
  const rows = (cranes.data?.items ?? []).flatMap((c) =>
    c.configurations.filter((k) => !k.current.retiredAt).map((k) => ({ crane: c, config: k })),
  );
  return (
    <div className="flex flex-col gap-2">
      {controls}
      {cranes.data && rows.length === 0 && (
        <p className="text-sm text-ink-soft">
          No configuration in your fleet library matches. Add cranes on the Fleet library page.
        </p>
      )}
      {rows.length > 0 && (
        <ul className="flex max-h-72 flex-col gap-1 overflow-auto" aria-label={listLabel}>
          {rows.map(({ crane, config }) => (
            <li
              key={config.id}
              className="flex items-center justify-between gap-2 border border-rule bg-sheet px-2.5 py-1.5 text-[13px]"
            >
              <span>
                <strong>{crane.fleetNumber}</strong> {crane.make} {crane.model} — {config.name}{' '}
                <span className="text-ink-soft">
                  v{config.current.number} · {WORKING_AREA_LABELS[config.workingArea]}
                  {config.capacityAtRadius !== null &&
                    ` · rates ${Number(config.capacityAtRadius.toPrecision(3))} ${config.capacityUnit} at that radius`}
                  {config.current.verified && ' · ✓ verified'}
                </span>
              </span>
              <Button size="sm" variant="primary" disabled={busy} onClick={() => onPick(config.current.id)}>
                Use this
              </Button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

export function LibraryPicker({
  packageId,
  fill,
  slot = 0,
}: {
  packageId: string;
  fill: (f: LibraryFill) => void;
  /** 0 for the crane of the first steps, 1 to 3 for crane 2 to 4 of a lift with several cranes */
  slot?: number;
}) {
  const uses = useLibraryUses(packageId);
  const setUse = useSetLibraryUse(packageId);
  const remove = useRemoveLibraryUse(packageId);
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const use = uses.data?.items.find((u) => u.slot === slot);
  const crane = slot === 0 ? 'the crane' : `crane ${slot + 1}`;
  const its =
    slot === 0 ? 'The crane and chart fields are' : `Crane ${slot + 1}'s configuration and chart are`;

  const pick = async (versionId: string) => {
    setError(null);
    try {
      const version = await api.get(`/api/library/versions/${encodeURIComponent(versionId)}`, VersionDetail);
      fill(fillFromVersion(version));
      await setUse.mutateAsync({ versionId, slot, detached: false });
      setOpen(false);
    } catch (e) {
      setError(isApiError(e) ? e.message : 'The configuration could not be used. Try again.');
    }
  };

  return (
    <section
      aria-label={slot === 0 ? 'Fleet library' : `Fleet library, crane ${slot + 1}`}
      className="mb-4 border border-l-4 border-verdigris bg-verdigris-tint px-3 py-2"
      data-slot={slot}
    >
      {use ? (
        <div className="flex flex-wrap items-center gap-2 text-[13.5px]">
          <p className="min-w-[16rem] flex-[1_1_24rem]">
            <strong>{use.detached ? 'Detached copy of' : 'From the fleet library:'}</strong>{' '}
            {use.version.crane}, {use.version.configurationName} (library version {use.version.number}).{' '}
            {use.detached
              ? `You may edit ${slot === 0 ? 'the crane and chart' : `crane ${slot + 1}'s configuration and chart`}; the engineer sees every cell changed from version ${use.version.number}${use.changedCells.length ? ` (${use.changedCells.length} so far)` : ''}.`
              : `${its} filled from it and read-only; enter boom length, radius and slew yourself.`}
            {use.verifications[0] && ` ✓ Verified by ${use.verifications[0].engineer.name}.`}
          </p>
          {!use.detached && (
            <Button
              size="sm"
              disabled={setUse.isPending}
              onClick={() => setUse.mutate({ versionId: use.version.id, slot, detached: true })}
            >
              Detach a copy to edit
            </Button>
          )}
          <Button size="sm" variant="quiet" onClick={() => setOpen((o) => !o)}>
            Pick another
          </Button>
          <Button size="sm" variant="quiet" disabled={remove.isPending} onClick={() => remove.mutate(slot)}>
            Stop using the library
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap items-center gap-2 text-[13.5px]">
          <p className="min-w-[16rem] flex-[1_1_24rem]">
            Pick {crane} and its configuration from your fleet library instead of typing its data and chart.
          </p>
          <Button size="sm" variant="primary" onClick={() => setOpen((o) => !o)}>
            {slot === 0 ? 'Pick from the fleet library' : `Pick crane ${slot + 1} from the fleet library`}
          </Button>
        </div>
      )}
      {open && (
        <div className="mt-2">
          <Finder
            onPick={pick}
            busy={setUse.isPending}
            listLabel={slot === 0 ? 'Configurations to pick' : `Configurations to pick for crane ${slot + 1}`}
          />
        </div>
      )}
      {error && <ErrorPanel title="Not used" message={error} />}
    </section>
  );
}

/** Per crane slot (0 to 3): a library version is in use and not detached, so its fields are read-only. */
export function useLibraryLocks(packageId: string): readonly boolean[] {
  const uses = useLibraryUses(packageId);
  return [0, 1, 2, 3].map((slot) => {
    const use = uses.data?.items.find((u) => u.slot === slot);
    return !!use && !use.detached;
  });
}

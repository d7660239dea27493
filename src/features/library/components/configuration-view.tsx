// A configuration: its versions (who changed what, when), the chosen version in full, and an
// edit that writes the next version. A version some package uses can be retired, not deleted.
// Opened from a package, the version that package uses is shown first, with the package's lift
// point(s) drawn on its pictures.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { CraneFixedData, LibraryUse } from '@shared/schemas/library';
import type { UnitSystem } from '@shared/schemas/common';
import { formatDate } from '@/lib/format';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { PageLoading } from '@/components/ui/page-loading';
import { ErrorPanel } from '@/components/ui/panel-message';
import { useAddVersion, useConfiguration } from '../api/configurations';
import { useRetireVersion, useVersion } from '../api/versions';
import { ConfigurationForm } from './configuration-form';
import { VersionPanel } from './version-panel';
import type { PackageOnChart } from './chart-plot';

/** The package the page was opened from (`?package=…`): its library uses and its lift figures. */
export interface OpenedFromPackage {
  id: string;
  reference: string;
  uses: LibraryUse[];
  /** What the package puts on a version's pictures: its cranes that use that version */
  onChart: (versionId: string) => PackageOnChart;
}

const craneOf = (u: LibraryUse, several: boolean) => (several ? `crane ${u.slot + 1}` : 'its crane');

function FromPackageNote({
  from,
  usedHere,
  shownId,
  numberOf,
  onShow,
}: {
  from: OpenedFromPackage;
  usedHere: LibraryUse[];
  shownId: string | undefined;
  numberOf: (versionId: string) => number | undefined;
  onShow: (versionId: string) => void;
}) {
  const ref = (
    <Link to={`/packages/${from.id}`} className="font-bold text-verdigris underline underline-offset-2">
      {from.reference}
    </Link>
  );
  if (!usedHere.length)
    return (
      <p className="border border-rule bg-sheet px-3 py-2 text-[13px]" data-testid="from-package">
        {ref} does not use this configuration: nothing of it is drawn on the pictures.
      </p>
    );
  const several = from.uses.length > 1 || from.uses.some((u) => u.slot > 0);
  const drawn = usedHere.filter((u) => u.version.id === shownId);
  const elsewhere = [...new Set(usedHere.map((u) => u.version.id))].filter((id) => id !== shownId);
  return (
    <div
      className="flex flex-col gap-1 border border-l-4 border-verdigris bg-verdigris-tint px-3 py-2 text-[13.5px]"
      data-testid="from-package"
    >
      <p>
        Opened from {ref}:{' '}
        {usedHere
          .map(
            (u) =>
              `${craneOf(u, several)} uses version ${u.version.number}${u.detached ? ' as a detached copy' : ''}`,
          )
          .join('; ')}
        .
      </p>
      {drawn.length > 0 && (
        <p>
          Its lift point{drawn.length > 1 ? 's are' : ' is'} drawn on the capacity chart below, and the hook
          height the lift needs on the working range.
          {drawn.some((u) => u.detached) &&
            ' The package uses an edited copy of this chart: the package page lists each changed cell.'}
        </p>
      )}
      {elsewhere.map((id) => (
        <p key={id} className="flex flex-wrap items-center gap-2">
          <span>
            Version {numberOf(id)} carries the package's lift point{drawn.length ? ' too' : ''}; this page
            shows version {shownId ? numberOf(shownId) : ''}.
          </span>
          <Button size="sm" onClick={() => onShow(id)}>
            Show version {numberOf(id)}
          </Button>
        </p>
      ))}
    </div>
  );
}

export function ConfigurationView({
  id,
  system,
  fromPackage,
}: {
  id: string;
  system: UnitSystem;
  fromPackage?: OpenedFromPackage;
}) {
  const config = useConfiguration(id);
  const [picked, setPicked] = useState<string | null>(null);
  const [editing, setEditing] = useState(false);
  const current = config.data?.versions.at(-1);
  const versions = config.data?.versions ?? [];
  // The package's cranes that use a version of this configuration, lead crane first.
  const usedHere = (fromPackage?.uses ?? []).filter((u) => versions.some((v) => v.id === u.version.id));
  const shownId = picked ?? usedHere[0]?.version.id ?? current?.id;
  const version = useVersion(shownId);
  const add = useAddVersion(id);
  const retire = useRetireVersion();
  if (config.isPending) return <PageLoading label="Reading the configuration" />;
  if (config.isError)
    return (
      <ErrorPanel
        title="The configuration could not be read"
        message={isApiError(config.error) ? config.error.message : 'Try again.'}
      />
    );
  const k = config.data;
  return (
    <div className="grid gap-4 lg:grid-cols-[280px_1fr]">
      <aside aria-label="Versions" className="flex flex-col gap-2">
        <h2 className="text-base font-bold">Versions</h2>
        <ol className="flex flex-col gap-1.5" reversed>
          {[...k.versions].reverse().map((v) => (
            <li key={v.id}>
              <button
                type="button"
                onClick={() => {
                  setPicked(v.id);
                  setEditing(false);
                }}
                aria-current={v.id === shownId ? 'true' : undefined}
                className={`w-full border px-2.5 py-1.5 text-left text-[13px] ${v.id === shownId ? 'border-ink bg-sheet font-bold' : 'border-rule bg-sheet-alt'}`}
              >
                Version {v.number}
                {v.retiredAt && ' · retired'}
                {v.verified && ' · ✓ verified'}
                <span className="block font-normal text-ink-soft">
                  {formatDate(v.createdAt)} by {v.createdBy.name}
                  {v.cellsChanged !== null &&
                    ` · ${v.cellsChanged} chart cell${v.cellsChanged === 1 ? '' : 's'} changed`}
                  {v.usedBy > 0 && ` · used by ${v.usedBy} package${v.usedBy === 1 ? '' : 's'}`}
                </span>
                {v.changeNote && <span className="block font-normal">“{v.changeNote}”</span>}
                {fromPackage && usedHere.some((u) => u.version.id === v.id) && (
                  <span className="block font-normal text-verdigris">used by {fromPackage.reference}</span>
                )}
              </button>
            </li>
          ))}
        </ol>
      </aside>
      <section aria-label="Version shown" className="flex flex-col gap-3">
        {fromPackage && (
          <FromPackageNote
            from={fromPackage}
            usedHere={usedHere}
            shownId={shownId}
            numberOf={(vid) => k.versions.find((v) => v.id === vid)?.number}
            onShow={(vid) => {
              setPicked(vid);
              setEditing(false);
            }}
          />
        )}
        {version.isPending && <PageLoading label="Reading the version" />}
        {version.data && (
          <>
            <div className="flex flex-wrap items-center gap-2">
              <h2 className="text-base font-bold">
                Version {version.data.number}
                {version.data.retiredAt && ' (retired: packages keep it, new ones cannot pick it)'}
              </h2>
              {!editing && (
                <Button variant="primary" size="sm" onClick={() => setEditing(true)}>
                  Edit (writes version {(current?.number ?? 0) + 1})
                </Button>
              )}
              {!version.data.retiredAt && (
                <Button size="sm" disabled={retire.isPending} onClick={() => retire.mutate(version.data.id)}>
                  Retire this version
                </Button>
              )}
            </div>
            {retire.isError && (
              <ErrorPanel
                title="Not retired"
                message={isApiError(retire.error) ? retire.error.message : 'Try again.'}
              />
            )}
            {editing ? (
              <ConfigurationForm
                system={system}
                fixed={version.data.crane.fixed as CraneFixedData}
                from={version.data}
                submitLabel={`Save as version ${(current?.number ?? 0) + 1}`}
                busy={add.isPending}
                serverErrors={isApiError(add.error) ? add.error.fields : undefined}
                onSubmit={(body) =>
                  add.mutate(body, {
                    onSuccess: (v) => {
                      setPicked(v.id);
                      setEditing(false);
                    },
                  })
                }
              />
            ) : (
              <VersionPanel
                version={version.data}
                canAttach
                fromPackage={
                  fromPackage && usedHere.some((u) => u.version.id === version.data.id)
                    ? fromPackage.onChart(version.data.id)
                    : undefined
                }
              />
            )}
            {add.isError && (
              <ErrorPanel
                title="The version was not saved"
                message={isApiError(add.error) ? add.error.message : 'Try again.'}
              />
            )}
          </>
        )}
      </section>
    </div>
  );
}

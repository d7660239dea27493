// A configuration: its versions (who changed what, when), the chosen version in full, and an
// edit that writes the next version. A version some package uses can be retired, not deleted.
import { useState } from 'react';
import type { CraneFixedData } from '@shared/schemas/library';
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

export function ConfigurationView({ id, system }: { id: string; system: UnitSystem }) {
  const config = useConfiguration(id);
  const [picked, setPicked] = useState<string | null>(null);
  const [editing, setEditing] = useState(false);
  const current = config.data?.versions.at(-1);
  const shownId = picked ?? current?.id;
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
              </button>
            </li>
          ))}
        </ol>
      </aside>
      <section aria-label="Version shown" className="flex flex-col gap-3">
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
              <VersionPanel version={version.data} canAttach />
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

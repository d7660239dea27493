// On a package (its page, and the checks tab of the review workspace): the library version each
// crane comes from, who on this desk verified each chart and when, and — for a detached copy —
// every cell changed from the library version. An engineer of the owner desk verifies a chart
// here that the desk has not verified yet.
import { Link } from 'react-router-dom';
import type { LibraryUse } from '@shared/schemas/library';
import { formatDate } from '@/lib/format';
import { useLibraryUses } from '../api/library-uses';
import { VerifyForm } from './version-panel';

function ChangedCells({ u }: { u: LibraryUse }) {
  return (
    <div className="border-l-4 border-caution-ink bg-caution-tint px-2 py-1" role="note">
      <p className="font-bold text-caution-ink">
        ! Chart edited from library version {u.version.number}:{' '}
        {u.changedCells.length === 0
          ? 'no cell differs (yet)'
          : `${u.changedCells.length} cell${u.changedCells.length === 1 ? '' : 's'} changed`}
      </p>
      {u.changedCells.length > 0 && (
        <table className="mt-1 text-[12.5px] tabular-nums">
          <thead>
            <tr className="text-left">
              <th className="pr-3">Boom ({u.units.boomLength})</th>
              <th className="pr-3">Radius ({u.units.radius})</th>
              <th className="pr-3">Library ({u.units.capacity})</th>
              <th>This package ({u.units.capacity})</th>
            </tr>
          </thead>
          <tbody>
            {u.changedCells.map((c) => (
              <tr key={`${c.boomLength}-${c.radius}`}>
                <td className="pr-3">{c.boomLength}</td>
                <td className="pr-3">{c.radius}</td>
                <td className="pr-3">{c.library ?? 'not rated'}</td>
                <td className="font-bold">{c.package ?? 'removed'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}

export function LibraryUsesPanel({
  packageId,
  canVerify = false,
  showEmpty = false,
  ownFleet = false,
}: {
  packageId: string;
  /** The contractor who keeps the fleet: a crane links to its configuration (history, edit) */
  ownFleet?: boolean;
  /** An engineer of the owner desk: offer the verification of a chart the desk has not verified */
  canVerify?: boolean;
  /** Say so when no crane comes from the library (the review workspace), instead of showing nothing */
  showEmpty?: boolean;
}) {
  const uses = useLibraryUses(packageId);
  const items = uses.data?.items ?? [];
  if (!items.length) {
    if (!showEmpty || !uses.data) return null;
    return (
      <p className="border border-rule bg-sheet px-3 py-2 text-[13px] text-ink-soft">
        No crane of this package comes from the fleet library: its crane data and chart were typed in.
      </p>
    );
  }
  const several = items.length > 1 || items.some((u) => u.slot > 0);
  return (
    <section
      aria-label="Cranes from the fleet library"
      className="flex flex-col gap-2 border border-rule bg-sheet px-4 py-3"
    >
      <h2 className="text-base font-bold">Cranes from the fleet library</h2>
      {items.map((u) => {
        const v = u.verifications[0];
        return (
          <div key={u.slot} className="flex flex-col gap-1 text-[13.5px]" data-testid="library-use">
            <p>
              {several && <strong>Crane {u.slot + 1}: </strong>}
              <Link
                to={
                  ownFleet
                    ? `/library/configurations/${u.version.configurationId}?package=${packageId}`
                    : `/library/versions/${u.version.id}?package=${packageId}`
                }
                className="font-bold text-verdigris underline underline-offset-2"
              >
                {u.version.crane}, {u.version.configurationName}
              </Link>{' '}
              (library version {u.version.number}
              {u.detached ? ', detached copy' : ''})
            </p>
            {v ? (
              <p className="border-l-4 border-pass-ink bg-pass-tint px-2 py-1">
                ✓ Chart verified against the manufacturer's document by {v.engineer.name} on{' '}
                {formatDate(v.at)}
                {u.detached ? ' — but this package uses an edited copy: read the changed cells below.' : '.'}
                {v.note && <span className="block text-[12.5px]">“{v.note}”</span>}
              </p>
            ) : (
              <p className="text-ink-soft">Not yet verified by this desk.</p>
            )}
            {u.detached && <ChangedCells u={u} />}
            {!v && canVerify && (
              <VerifyForm
                versionId={u.version.id}
                packageId={packageId}
                label={`Verify the chart of crane ${u.slot + 1}`}
              />
            )}
          </div>
        );
      })}
    </section>
  );
}

// /library/versions/:id[?package=…]: one library version as the owner side reads it from a
// package that uses it; the engineer marks the chart verified for the desk here. Opened from a
// package, the pictures show each of its cranes that uses this version (lift point, hook needed).
import { useParams, useSearchParams } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { isApiError } from '@/lib/api-client';
import { PageHeader } from '@/components/layouts/page-header';
import { PageLoading } from '@/components/ui/page-loading';
import { ErrorPanel } from '@/components/ui/panel-message';
import { useVersion } from '@/features/library/api/versions';
import { VersionPanel } from '@/features/library/components/version-panel';
import { versionLabel } from '@shared/library/to-lift-input';
import { craneLiftFigures } from '@shared/library/lift-points';
import { readStoredResult } from '@shared/engineering/stored-result';
import { useQuery } from '@tanstack/react-query';
import { packageQueryOptions } from '@/features/packages/api/get-package';
import { libraryUsesQueryOptions } from '@/features/library/api/library-uses';

export default function LibraryVersionRoute() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const packageId = search.get('package') ?? undefined;
  const { data: user } = useCurrentUser();
  const version = useVersion(id);
  const pkg = useQuery({ ...packageQueryOptions(packageId ?? ''), enabled: !!packageId });
  const uses = useQuery({ ...libraryUsesQueryOptions(packageId ?? ''), enabled: !!packageId });
  if (!user) return null;
  // Opened from a package: the cranes of it that use this version, with their lift figures.
  const slots = (uses.data?.items ?? []).filter((u) => u.version.id === id).map((u) => u.slot);
  const fromPackage =
    packageId && pkg.data && uses.data
      ? {
          reference: pkg.data.package.reference,
          cranes: slots.map((slot) =>
            craneLiftFigures(pkg.data.current.inputs, readStoredResult(pkg.data.current.results), slot),
          ),
        }
      : undefined;
  return (
    <>
      <PageHeader
        title={version.data ? versionLabel(version.data) : 'Library chart'}
        context="Crane configuration from the contractor's fleet library"
      />
      {version.isPending && <PageLoading label="Reading the chart" />}
      {version.isError && (
        <ErrorPanel
          title="The chart could not be read"
          message={isApiError(version.error) ? version.error.message : 'Try again.'}
        />
      )}
      {fromPackage && slots.length === 0 && (
        <p className="mb-3 border border-rule bg-sheet px-3 py-2 text-[13px]">
          {fromPackage.reference} does not use this version: nothing of it is drawn on the chart.
        </p>
      )}
      {version.data && (
        <VersionPanel
          version={version.data}
          canVerify={user.role === 'engineer' && user.organisation.kind === 'owner'}
          packageId={packageId}
          fromPackage={fromPackage}
        />
      )}
    </>
  );
}

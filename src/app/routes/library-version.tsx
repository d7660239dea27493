// /library/versions/:id[?package=…]: one library version as the owner side reads it from a
// package that uses it; the engineer marks the chart verified for the desk here.
import { useParams, useSearchParams } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { isApiError } from '@/lib/api-client';
import { PageHeader } from '@/components/layouts/page-header';
import { PageLoading } from '@/components/ui/page-loading';
import { ErrorPanel } from '@/components/ui/panel-message';
import { useVersion } from '@/features/library/api/versions';
import { VersionPanel } from '@/features/library/components/version-panel';
import { versionLabel } from '@shared/library/to-lift-input';
import { TO_SI } from '@shared/engineering/units';
import type { LiftFigures } from '@shared/engineering/types';
import { useQuery } from '@tanstack/react-query';
import { packageQueryOptions } from '@/features/packages/api/get-package';

export default function LibraryVersionRoute() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const packageId = search.get('package') ?? undefined;
  const { data: user } = useCurrentUser();
  const version = useVersion(id);
  const pkg = useQuery({ ...packageQueryOptions(packageId ?? ''), enabled: !!packageId });
  if (!user) return null;
  // The package's lift point (its recomputed radius and gross load), in the chart's units.
  const figures = (pkg.data?.current.results as { figures?: LiftFigures } | null | undefined)?.figures;
  const units = version.data?.chart.units;
  const liftPoints =
    packageId && figures?.radius != null && units
      ? [
          {
            radius: figures.radius / TO_SI[units.radius],
            load: figures.grossLoad / TO_SI[units.capacity],
            label: `${pkg.data?.package.reference}: gross load`,
          },
        ]
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
      {version.data && (
        <VersionPanel
          version={version.data}
          canVerify={user.role === 'engineer'}
          packageId={packageId}
          liftPoints={liftPoints}
        />
      )}
    </>
  );
}

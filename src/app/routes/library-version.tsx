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
import { usePackageOnChart } from '../package-on-chart';

export default function LibraryVersionRoute() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const packageId = search.get('package') ?? undefined;
  const { data: user } = useCurrentUser();
  const version = useVersion(id);
  const opened = usePackageOnChart(packageId);
  if (!user) return null;
  const fromPackage = opened?.state === 'ready' ? opened.onChart(id) : undefined;
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
      {opened?.state === 'error' && (
        <p className="mb-3 border border-rule bg-sheet px-3 py-2 text-[13px]" role="alert">
          {opened.message} Nothing of the package is drawn on the chart.
        </p>
      )}
      {fromPackage && fromPackage.cranes.length === 0 && (
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

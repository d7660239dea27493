// /library/configurations/:id[?package=…]: a configuration's versions, chart and pictures
// (contractor). Opened from a package, the version it uses is shown with its lift point(s).
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { useConfiguration } from '@/features/library/api/configurations';
import { ConfigurationView } from '@/features/library/components/configuration-view';
import { usePackageOnChart } from '../package-on-chart';

export default function LibraryConfigurationRoute() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const { data: user } = useCurrentUser();
  const config = useConfiguration(id);
  const fromPackage = usePackageOnChart(search.get('package') ?? undefined);
  if (!user) return null;
  return (
    <>
      <PageHeader
        title={config.data?.name ?? 'Configuration'}
        context={
          config.data && (
            <Link
              to={`/library/cranes/${config.data.craneId}`}
              className="text-verdigris underline underline-offset-2"
            >
              ← The crane
            </Link>
          )
        }
      />
      {fromPackage?.state === 'error' && (
        <p className="mb-3 border border-rule bg-sheet px-3 py-2 text-[13px]" role="alert">
          {fromPackage.message} Nothing of the package is drawn on the pictures.
        </p>
      )}
      <ConfigurationView
        id={id}
        system={user.unitSystem}
        fromPackage={fromPackage?.state === 'ready' ? fromPackage : undefined}
      />
    </>
  );
}

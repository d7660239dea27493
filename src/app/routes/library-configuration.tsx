// /library/configurations/:id: a configuration's versions, chart and pictures (contractor).
import { Link, useParams } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { useConfiguration } from '@/features/library/api/configurations';
import { ConfigurationView } from '@/features/library/components/configuration-view';

export default function LibraryConfigurationRoute() {
  const { id = '' } = useParams();
  const { data: user } = useCurrentUser();
  const config = useConfiguration(id);
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
      <ConfigurationView id={id} system={user.unitSystem} />
    </>
  );
}

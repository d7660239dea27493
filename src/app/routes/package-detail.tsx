// /packages/:id: the package's summary. The review workspace (inputs, recomputed checks,
// findings, markups, revisions side by side) is built on this page by the next feature.
import { Link, useParams } from 'react-router-dom';
import { homeFor, useCurrentUser } from '@/lib/auth';
import { isApiError } from '@/lib/api-client';
import { PageHeader } from '@/components/layouts/page-header';
import { EmptyState, ErrorPanel } from '@/components/ui/panel-message';
import { PageLoading } from '@/components/ui/page-loading';
import { usePackage } from '@/features/packages/api/get-package';
import { PackageHeading } from '@/features/packages/components/package-heading';

export default function PackageDetailRoute() {
  const { id = '' } = useParams();
  const { data: user } = useCurrentUser();
  const detail = usePackage(id);
  if (!user) return null;

  const back = (
    <Link to={homeFor(user)} className="font-bold text-verdigris underline underline-offset-2">
      Back to your list
    </Link>
  );

  if (detail.isPending) return <PageLoading label="Loading the package" />;
  if (detail.isError) {
    const notFound = isApiError(detail.error) && (detail.error.status === 404 || detail.error.status === 400);
    return (
      <>
        <PageHeader title="Lift package" />
        <ErrorPanel
          title={notFound ? 'No such package in your list' : 'The package could not be loaded'}
          message={
            notFound
              ? 'This package does not exist, or it belongs to an organisation or site you do not work with.'
              : isApiError(detail.error)
                ? detail.error.message
                : 'Something went wrong while loading the package.'
          }
          action={back}
        />
      </>
    );
  }

  return (
    <>
      <PackageHeading pkg={detail.data.package} />
      <EmptyState title="The review workspace arrives with the next feature">
        <p>
          This page will show the lift inputs beside the recomputed checks, the plan pages with markups, the
          findings and the differences between revisions. {back}.
        </p>
      </EmptyState>
    </>
  );
}

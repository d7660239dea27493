// /packages/:id/review: the review workspace. The assigned engineer of record marks up the
// pages, writes findings and decides; coordinators and administrators see it read-only.
// The page loads the package and composes the workspace feature; pdf.js loads on demand.
import { Link, useParams } from 'react-router-dom';
import { homeFor, useCurrentUser } from '@/lib/auth';
import { isApiError } from '@/lib/api-client';
import { PageHeader } from '@/components/layouts/page-header';
import { ErrorPanel } from '@/components/ui/panel-message';
import { PageLoading } from '@/components/ui/page-loading';
import { usePackage } from '@/features/packages/api/get-package';
import { ReviewWorkspace } from '@/features/review-workspace/components/review-workspace';
import { LibraryUsesPanel } from '@/features/library/components/library-uses-panel';

export default function ReviewWorkspaceRoute() {
  const { id = '' } = useParams();
  const { data: user } = useCurrentUser();
  const detail = usePackage(id);
  if (!user) return null;

  if (detail.isPending) return <PageLoading label="Opening the review workspace" />;
  if (detail.isError) {
    const notFound = isApiError(detail.error) && (detail.error.status === 404 || detail.error.status === 400);
    return (
      <>
        <PageHeader title="Review workspace" />
        <ErrorPanel
          title={notFound ? 'No such package in your list' : 'The package could not be loaded'}
          message={
            notFound
              ? 'This package does not exist, or it is not assigned to you or your sites.'
              : isApiError(detail.error)
                ? detail.error.message
                : 'Something went wrong while loading the package.'
          }
          action={
            <Link to={homeFor(user)} className="font-bold text-verdigris underline underline-offset-2">
              Back to your list
            </Link>
          }
        />
      </>
    );
  }
  if (detail.data.current.state !== 'submitted') {
    return (
      <>
        <PageHeader title="Review workspace" />
        <ErrorPanel
          title="Nothing to review yet"
          message="The contractor has not submitted this revision. The workspace opens once it is submitted."
          action={
            <Link to={`/packages/${id}`} className="font-bold text-verdigris underline underline-offset-2">
              Back to the package
            </Link>
          }
        />
      </>
    );
  }
  // An engineer of the owner desk verifies a library chart the desk has not verified yet.
  const canVerify = user.role === 'engineer' && user.organisation.kind === 'owner';
  return (
    <ReviewWorkspace
      key={detail.data.package.id}
      detail={detail.data}
      user={user}
      library={<LibraryUsesPanel packageId={id} canVerify={canVerify} showEmpty />}
    />
  );
}

// /packages/:id/edit: the contractor's submission editor for the package's draft revision.
// A package that is no longer a draft opens read-only on its package page instead.
import { Link, useParams } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { isApiError } from '@/lib/api-client';
import { PageLoading } from '@/components/ui/page-loading';
import { ErrorPanel, EmptyState } from '@/components/ui/panel-message';
import { usePackage } from '@/features/packages/api/get-package';
import { SubmissionEditor } from '@/features/packages/components/editor/submission-editor';
import { LibraryPicker, useLibraryLocks } from '@/features/library/components/library-picker';
import { useCraneRemoved } from '@/features/library/api/library-uses';

export default function PackageEditRoute() {
  const { id = '' } = useParams();
  const { data: user } = useCurrentUser();
  const detail = usePackage(id);
  const locks = useLibraryLocks(id);
  const craneRemoved = useCraneRemoved(id);
  if (!user) return null;
  if (detail.isPending) return <PageLoading label="Opening the draft" />;
  if (detail.isError)
    return (
      <ErrorPanel
        title="The draft could not be opened"
        message={
          isApiError(detail.error) ? detail.error.message : 'Something went wrong while loading the draft.'
        }
        action={
          <Link to="/packages" className="font-bold text-verdigris underline underline-offset-2">
            Back to your packages
          </Link>
        }
      />
    );
  if (detail.data.current.state !== 'draft')
    return (
      <EmptyState title={`Revision ${detail.data.current.number} has been submitted`}>
        <p>
          A submitted revision is frozen.{' '}
          <Link to={`/packages/${id}`} className="font-bold text-verdigris underline">
            Open the package
          </Link>{' '}
          to follow its check and review.
        </p>
      </EmptyState>
    );
  return (
    <SubmissionEditor
      key={detail.data.current.id}
      detail={detail.data}
      system={user.unitSystem}
      library={{
        locked: (slot) => locks[slot] ?? false,
        picker: (fill, slot) => <LibraryPicker packageId={id} fill={fill} slot={slot} />,
        onCraneRemoved: (slot) => craneRemoved.mutate(slot),
      }}
    />
  );
}

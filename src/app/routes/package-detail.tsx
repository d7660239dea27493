// /packages/:id: a holding page until the review workspace is built.
import { Link, useParams } from 'react-router-dom';
import { homeFor, useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { EmptyState } from '@/components/ui/panel-message';

export default function PackageDetailRoute() {
  const { id } = useParams();
  const { data: user } = useCurrentUser();
  if (!user) return null;
  return (
    <>
      <PageHeader title="Lift package" context={<span className="font-mono">{id}</span>} />
      <EmptyState title="The package workspace arrives with the next feature">
        <p>
          This page will show the package's inputs, the recomputed checks, findings and revisions.{' '}
          <Link to={homeFor(user)} className="font-bold text-verdigris underline underline-offset-2">
            Back to your list
          </Link>
          .
        </p>
      </EmptyState>
    </>
  );
}

// /packages: the contractor's desk — their organisation's lift packages, each with its
// status, site, planned lift date, revision and what it is waiting on.
import { Link } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { buttonClasses } from '@/components/ui/button';
import { PageHeader } from '@/components/layouts/page-header';
import { PackageListView } from '@/features/packages/components/package-list-view';

export default function PackagesRoute() {
  const { data: user } = useCurrentUser();
  if (!user) return null;
  return (
    <>
      <PageHeader
        title="Lift packages"
        context={`Every lift package from ${user.organisation.name}, nearest lift first.`}
        actions={
          <Link to="/packages/new" className={buttonClasses('primary')}>
            + New lift package
          </Link>
        }
      />
      <PackageListView
        role={user.role}
        variant="desk"
        caption="Lift packages of your organisation"
        emptyTitle="No lift packages yet"
        emptyBody={
          <p>
            A lift package appears here as soon as someone at {user.organisation.name} starts one: its status,
            site, planned lift date, revision and what it is waiting on.{' '}
            <Link to="/packages/new" className="font-bold text-verdigris underline underline-offset-2">
              Start a new lift package
            </Link>
            .
          </p>
        }
      />
    </>
  );
}

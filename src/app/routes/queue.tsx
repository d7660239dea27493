// /queue: the coordinator's site queue — counts by status, search and filters kept in the
// URL, server-side paging, nearest planned lift first.
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { PackageListView } from '@/features/packages/components/package-list-view';

export default function QueueRoute() {
  const { data: user } = useCurrentUser();
  if (!user) return null;
  return (
    <>
      <PageHeader
        title="Site queue"
        context={
          user.role === 'admin'
            ? 'Every lift package on every site.'
            : `Lift packages for the sites of ${user.organisation.name}.`
        }
      />
      <PackageListView
        role={user.role}
        variant="queue"
        caption="Site queue"
        emptyTitle="The queue is empty"
        emptyBody={
          <p>
            Packages appear here when a contractor submits a lift package for one of your sites and the
            independent check has run.
          </p>
        }
      />
    </>
  );
}

// /admin: the desk administrator's overview — the state of the desk's services and every
// lift package. Users, organisations, sites and policies come with later work.
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { QueueView } from './queue';
import { HealthStrip } from '@/features/health/components/health-strip';

export default function AdminRoute() {
  const { data: user } = useCurrentUser();
  if (!user) return null;
  return (
    <>
      <PageHeader
        title="Desk administration"
        context="Every lift package on the desk, across all organisations and sites."
        actions={<HealthStrip />}
      />
      <QueueView
        userId={user.id}
        role={user.role}
        scope="admin"
        variant="queue"
        caption="All lift packages"
        emptyTitle="No lift packages on the desk"
        emptyBody={<p>Packages appear here once contractors start lift packages for any site.</p>}
      />
    </>
  );
}

// /assigned: the engineer of record's list — packages assigned to them.
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { QueueView } from './queue';

export default function AssignedRoute() {
  const { data: user } = useCurrentUser();
  if (!user) return null;
  return (
    <>
      <PageHeader
        title="Assigned to me"
        context="Lift packages a coordinator has assigned to you for review and decision."
      />
      <QueueView
        userId={user.id}
        role={user.role}
        scope="assigned"
        variant="assigned"
        caption="Packages assigned to you"
        emptyTitle="Nothing is assigned to you"
        emptyBody={
          <p>
            When a coordinator assigns you a lift package to review, it appears here with its planned lift
            date.
          </p>
        }
      />
    </>
  );
}

// /admin: the desk administrator's home — the state of the desk's services, a card for
// each thing they run (organisations, sites, people, review policies, the mail outbox),
// and every lift package on the desk under its own tab (?tab=packages).
import { Link, useSearchParams } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { QueueView } from './queue';
import { HealthStrip } from '@/features/health/components/health-strip';
import { DeskOverview } from '@/features/admin/components/desk-overview';

function tabClass(active: boolean) {
  return `inline-flex h-9 items-center border-b-[3px] px-3 text-sm font-bold ${
    active ? 'border-ink text-ink' : 'border-transparent text-ink-soft hover:text-ink'
  }`;
}

export default function AdminRoute() {
  const { data: user } = useCurrentUser();
  const [params] = useSearchParams();
  const tab = params.get('tab') === 'packages' ? 'packages' : 'desk';
  if (!user) return null;
  return (
    <>
      <PageHeader
        title="Desk administration"
        context="Organisations, sites, people, review policies and mail — and every lift package on the desk."
        actions={<HealthStrip />}
      />
      <nav aria-label="Administration views" className="mb-4 flex gap-1 border-b border-rule">
        <Link
          to="/admin"
          className={tabClass(tab === 'desk')}
          aria-current={tab === 'desk' ? 'page' : undefined}
        >
          The desk
        </Link>
        <Link
          to="/admin?tab=packages"
          className={tabClass(tab === 'packages')}
          aria-current={tab === 'packages' ? 'page' : undefined}
        >
          All lift packages
        </Link>
      </nav>
      {tab === 'desk' ? (
        <DeskOverview />
      ) : (
        <QueueView
          userId={user.id}
          role={user.role}
          scope="admin"
          variant="queue"
          caption="All lift packages"
          emptyTitle="No lift packages on the desk"
          emptyBody={<p>Packages appear here once contractors start lift packages for any site.</p>}
        />
      )}
    </>
  );
}

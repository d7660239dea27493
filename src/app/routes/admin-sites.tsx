// /admin/sites — the sites lift packages are submitted to: their codes and time zones,
// the lift coordinators who receive them, and the way to each site's review policy.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/panel-message';
import { useAdminSites, type AdminSite } from '@/features/admin/api/sites';
import { AdminTable, ListStates, type AdminColumn } from '@/features/admin/components/admin-table';
import { SiteDialog } from '@/features/admin/components/site-dialog';
import { ReviewersDialog } from '@/features/admin/components/reviewers-dialog';

const COLUMNS: AdminColumn[] = [
  { label: 'Site' },
  { label: 'Code' },
  { label: 'Time zone' },
  { label: 'Lift coordinators' },
  { label: 'Review policy' },
  { label: 'Actions', hidden: true },
];

export default function AdminSitesRoute() {
  const { data: user } = useCurrentUser();
  const sites = useAdminSites();
  const [editing, setEditing] = useState<AdminSite | 'new' | null>(null);
  const [reviewersOf, setReviewersOf] = useState<AdminSite | null>(null);
  if (!user) return null;
  const items = [...(sites.data?.items ?? [])].sort((a, b) => a.name.localeCompare(b.name));

  return (
    <>
      <PageHeader
        title="Sites and policies"
        context="Each site has its lift coordinators and its own review policy."
        actions={
          <Button variant="primary" onClick={() => setEditing('new')}>
            New site
          </Button>
        }
      />
      <ListStates
        query={sites}
        loading="Loading sites"
        failed="Sites could not be loaded"
        isEmpty={() => items.length === 0}
        empty={
          <EmptyState title="No sites yet">
            <p>
              Create a site so contractors can submit lift packages to it, then choose its lift coordinators.
            </p>
          </EmptyState>
        }
      >
        {() => (
          <AdminTable caption="Sites" columns={COLUMNS}>
            {items.map((site) => (
              <tr key={site.id} className="border-b border-rule align-top last:border-b-0">
                <td className="px-3 py-2">
                  <span className="block font-bold">{site.name}</span>
                  {site.address && <span className="block text-[12.5px] text-ink-soft">{site.address}</span>}
                </td>
                <td className="px-3 py-2 font-mono text-[13px]">{site.code}</td>
                <td className="px-3 py-2 text-[13px]">{site.timeZone}</td>
                <td className="px-3 py-2">
                  {site.reviewers.length === 0 ? (
                    <span className="font-bold text-caution-ink">
                      <span aria-hidden="true">▲ </span>None: submitted packages notify no one
                    </span>
                  ) : (
                    <ul className="flex flex-col">
                      {site.reviewers.map((reviewer) => (
                        <li key={reviewer.id} title={reviewer.email}>
                          {reviewer.name}
                        </li>
                      ))}
                    </ul>
                  )}
                  <Button
                    size="sm"
                    variant="quiet"
                    className="-ml-2.5 mt-0.5"
                    onClick={() => setReviewersOf(site)}
                    aria-label={`Choose coordinators for ${site.name}`}
                  >
                    Choose coordinators
                  </Button>
                </td>
                <td className="px-3 py-2">
                  <span className="block text-[13px] tabular">Version {site.policyVersion}</span>
                  <Link
                    to={`/admin/sites/${site.id}/policy`}
                    className="text-[13px] font-bold text-verdigris hover:underline"
                    aria-label={`Limits and sources of the review policy for ${site.name}`}
                  >
                    Limits and sources
                  </Link>
                </td>
                <td className="px-3 py-2 text-right">
                  <Button size="sm" onClick={() => setEditing(site)} aria-label={`Edit ${site.name}`}>
                    Edit
                  </Button>
                </td>
              </tr>
            ))}
          </AdminTable>
        )}
      </ListStates>
      {editing && (
        <SiteDialog site={editing === 'new' ? undefined : editing} onClose={() => setEditing(null)} />
      )}
      {reviewersOf && (
        <ReviewersDialog
          site={reviewersOf}
          organisationId={user.organisation.id}
          organisationName={user.organisation.name}
          onClose={() => setReviewersOf(null)}
        />
      )}
    </>
  );
}

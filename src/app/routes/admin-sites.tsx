// /admin/sites — the sites lift packages are submitted to: their codes and time zones,
// the lift coordinators who receive them, and the way to each site's review policy.
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useCurrentUser } from '@/lib/auth';
import { PageHeader } from '@/components/layouts/page-header';
import { Button } from '@/components/ui/button';
import { PageLoading } from '@/components/ui/page-loading';
import { EmptyState, ErrorPanel } from '@/components/ui/panel-message';
import { useAdminSites, type AdminSite } from '@/features/admin/api/sites';
import { SiteDialog } from '@/features/admin/components/site-dialog';
import { ReviewersDialog } from '@/features/admin/components/reviewers-dialog';

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
      {sites.isPending ? (
        <PageLoading label="Loading sites" />
      ) : sites.isError ? (
        <ErrorPanel title="Sites could not be loaded" message={sites.error.message} />
      ) : items.length === 0 ? (
        <EmptyState title="No sites yet">
          <p>
            Create a site so contractors can submit lift packages to it, then choose its lift coordinators.
          </p>
        </EmptyState>
      ) : (
        <table className="w-full border-collapse border border-rule bg-sheet text-sm">
          <caption className="sr-only">Sites</caption>
          <thead className="bg-sheet-alt text-left text-[12.5px] uppercase tracking-[0.06em] text-ink-soft">
            <tr className="border-b border-rule">
              <th scope="col" className="px-3 py-2 font-bold">
                Site
              </th>
              <th scope="col" className="px-3 py-2 font-bold">
                Code
              </th>
              <th scope="col" className="px-3 py-2 font-bold">
                Time zone
              </th>
              <th scope="col" className="px-3 py-2 font-bold">
                Lift coordinators
              </th>
              <th scope="col" className="px-3 py-2 font-bold">
                Review policy
              </th>
              <th scope="col" className="px-3 py-2">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
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
          </tbody>
        </table>
      )}
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

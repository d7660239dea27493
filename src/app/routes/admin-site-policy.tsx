// /admin/sites/:id/policy — the limits one site's lift packages are checked against, each
// beside its default and source, with the record of who changed what.
import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '@/components/layouts/page-header';
import { PageLoading } from '@/components/ui/page-loading';
import { ErrorPanel } from '@/components/ui/panel-message';
import { useAdminSites } from '@/features/admin/api/sites';
import { useSitePolicy } from '@/features/admin/api/site-policy';
import { PolicyEditor } from '@/features/admin/components/policy-editor';
import { PolicyHistory } from '@/features/admin/components/policy-history';

export default function AdminSitePolicyRoute() {
  const { id = '' } = useParams();
  const policy = useSitePolicy(id);
  const sites = useAdminSites();
  const site = sites.data?.items.find((item) => item.id === id);

  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-1 text-[13px]">
        <Link to="/admin/sites" className="font-bold text-verdigris hover:underline">
          Sites
        </Link>
        <span className="text-ink-soft"> / {site ? site.name : 'Site'} / Review policy</span>
      </nav>
      <PageHeader
        title={site ? `Review policy · ${site.name}` : 'Review policy'}
        context={
          policy.data
            ? `Policy version ${policy.data.policyVersion}${site ? ` · site code ${site.code}` : ''}`
            : undefined
        }
      />
      {policy.isPending ? (
        <PageLoading label="Loading the site's policy" />
      ) : policy.isError ? (
        <ErrorPanel title="The policy could not be loaded" message={policy.error.message} />
      ) : (
        <div className="grid grid-cols-1 gap-5 2xl:grid-cols-[minmax(0,1fr)_320px]">
          <div className="flex min-w-0 flex-col gap-3">
            <div className="border-l-4 border-brass bg-sheet px-4 py-2.5 text-[13.5px] leading-relaxed">
              <p>
                <strong>Changes apply to check runs from the moment you save.</strong> Returns already issued
                never change: each stored check result records the policy version it was computed with, and
                packages already checked keep their results until their next check run.
              </p>
              <p className="mt-1 text-ink-soft">
                Leave a field empty to use the default. A site value stricter than a manufacturer&apos;s chart
                or a local regulation is fine; a looser one does not relax either.
              </p>
            </div>
            <PolicyEditor siteId={id} policy={policy.data} />
          </div>
          <aside
            aria-labelledby="history-heading"
            className="self-start border border-rule bg-sheet px-4 py-3"
          >
            <h2 id="history-heading" className="mb-2 text-base font-bold">
              Changes to this policy
            </h2>
            <PolicyHistory history={policy.data.history} />
          </aside>
        </div>
      )}
    </>
  );
}

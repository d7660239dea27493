// /queue: the coordinator's site queue — counts by status, search and every filter kept
// in the URL, saved views, server-side sorting and paging, nearest planned lift first,
// and assigning engineers of record to one package or to many at once. The engineer's
// list (/assigned) and the administrator's overview use the same view with fewer powers.
import { useCallback, useMemo, useState, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { Role } from '@shared/schemas/common';
import type { PackageListResponse, PackageSummary } from '@shared/schemas/packages';
import { useCurrentUser } from '@/lib/auth';
import { packageKeys } from '@/lib/query-keys';
import { PageHeader } from '@/components/layouts/page-header';
import { PackageListView } from '@/features/packages/components/package-list-view';
import type { PackageTableVariant } from '@/features/packages/components/package-columns';
import { usePackages } from '@/features/packages/api/get-packages';
import { useSites } from '@/features/packages/api/get-sites';
import { usePackageListParams } from '@/features/packages/hooks/use-package-list-params';
import { useEngineers } from '@/features/review-desk/api/get-engineers';
import { useContractors } from '@/features/review-desk/api/get-contractors';
import { QueueFilters } from '@/features/review-desk/components/queue-filters';
import { SavedViews } from '@/features/review-desk/components/saved-views';
import { AssignBar } from '@/features/review-desk/components/assign-bar';
import { EngineerPicker } from '@/features/review-desk/components/engineer-picker';

/** Every package row this browser has seen in any list page still in the cache. */
function useRowsSeen(): Map<string, PackageSummary> {
  const queryClient = useQueryClient();
  const { filters } = usePackageListParams();
  // Re-read whenever the current page's data changes; other cached pages come along.
  const { data } = usePackages(filters);
  return useMemo(() => {
    void data;
    const rows = new Map<string, PackageSummary>();
    for (const [, page] of queryClient.getQueriesData<PackageListResponse>({
      queryKey: packageKeys.lists(),
    })) {
      for (const item of page?.items ?? []) rows.set(item.id, item);
    }
    return rows;
  }, [queryClient, data]);
}

export function QueueView({
  userId,
  role,
  variant,
  scope,
  caption,
  emptyTitle,
  emptyBody,
}: {
  userId: string;
  role: Role;
  variant: PackageTableVariant;
  /** Which list the saved views belong to. */
  scope: string;
  caption: string;
  emptyTitle: string;
  emptyBody: ReactNode;
}) {
  const { filters, update } = usePackageListParams();
  const sites = useSites();
  const seeEngineers = role === 'reviewer' || role === 'admin';
  const engineers = useEngineers({ enabled: seeEngineers });
  const adminContractors = useContractors({ enabled: role === 'admin' });
  const rowsSeen = useRowsSeen();
  const [selected, setSelected] = useState<ReadonlySet<string>>(() => new Set());
  const canAssign = role === 'reviewer';

  // Coordinators have no list of contractors of their own: offer the ones in rows seen.
  const contractors = useMemo(() => {
    if (role === 'admin' && adminContractors.data) return adminContractors.data;
    const byId = new Map<string, string>();
    for (const row of rowsSeen.values()) byId.set(row.contractor.id, row.contractor.name);
    return [...byId].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name));
  }, [role, adminContractors.data, rowsSeen]);

  const referenceOf = useCallback((id: string) => rowsSeen.get(id)?.reference, [rowsSeen]);
  const engineerList = engineers.data?.items;
  const engineerCell = useMemo(
    () =>
      canAssign ? (pkg: PackageSummary) => <EngineerPicker pkg={pkg} engineers={engineerList} /> : undefined,
    [canAssign, engineerList],
  );

  return (
    <PackageListView
      role={role}
      variant={variant}
      caption={caption}
      emptyTitle={emptyTitle}
      emptyBody={emptyBody}
      moreFilters={
        <>
          <QueueFilters
            filters={filters}
            onChange={(changes) => update(changes)}
            sites={sites.data?.items}
            contractors={contractors}
            engineers={seeEngineers ? (engineerList ?? []) : undefined}
          />
          <SavedViews userId={userId} scope={scope} />
        </>
      }
      aboveTable={
        canAssign && (
          <AssignBar
            selected={selected}
            onClear={() => setSelected(new Set())}
            onAssigned={() => setSelected(new Set())}
            engineers={engineerList}
            referenceOf={referenceOf}
          />
        )
      }
      selection={canAssign ? { selected, onChange: setSelected } : undefined}
      engineerCell={engineerCell}
    />
  );
}

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
      <QueueView
        userId={user.id}
        role={user.role}
        variant="queue"
        scope="queue"
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

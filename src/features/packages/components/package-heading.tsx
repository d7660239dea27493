// The facts at the top of a package: reference, lift, status, site, contractor, planned
// lift date, revision and engineer.
import type { ReactNode } from 'react';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { PackageSummary } from '@shared/schemas/packages';
import { StatusBadge } from '@/components/ui/status-badge';
import { CheckStatusMark } from '@/components/ui/check-status-mark';
import { DateWithUrgency } from '@/components/ui/date-with-urgency';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="border-r border-rule px-4 py-2.5 last:border-r-0">
      <dt className="text-[12px] font-bold uppercase tracking-[0.06em] text-ink-soft">{label}</dt>
      <dd className="mt-0.5 text-sm">{children}</dd>
    </div>
  );
}

export function PackageHeading({ pkg }: { pkg: PackageSummary }) {
  return (
    <section aria-label="Package summary" className="mb-4">
      <header className="mb-3 flex flex-wrap items-end justify-between gap-3 border-b-2 border-ink pb-2.5">
        <div>
          <p className="font-mono text-[13px] font-bold text-ink-soft">{pkg.reference}</p>
          <h1 className="text-[22px] font-black leading-tight">{pkg.title}</h1>
        </div>
        <div className="flex items-center gap-2">
          <StatusBadge status={pkg.status} />
          {pkg.decision && <span className="text-sm font-bold">{DECISION_LABELS[pkg.decision]}</span>}
        </div>
      </header>
      <dl className="grid grid-cols-2 border border-rule bg-sheet md:grid-cols-3 xl:grid-cols-6">
        <Fact label="Site">{pkg.site.name}</Fact>
        <Fact label="Contractor">{pkg.contractor.name}</Fact>
        <Fact label="Planned lift">
          <DateWithUrgency value={pkg.plannedLiftDate} settled={pkg.status === 'returned'} />
        </Fact>
        <Fact label="Revision">
          <span className="tabular">{pkg.revisionNumber}</span>
        </Fact>
        <Fact label="Engineer of record">
          {pkg.engineer?.name ?? <span className="text-ink-soft">Not assigned</span>}
        </Fact>
        <Fact label="Independent check">
          {pkg.worstStatus ? (
            <CheckStatusMark status={pkg.worstStatus} />
          ) : (
            <span className="text-ink-soft">Not run yet</span>
          )}
        </Fact>
      </dl>
    </section>
  );
}

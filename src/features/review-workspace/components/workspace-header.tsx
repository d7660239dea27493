// The workspace's title line (package, revision, status, decision, engineer of record) and,
// when the person may only look, the note that says why.
import { Link } from 'react-router-dom';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { PackageDetail } from '@shared/schemas/packages';
import { StatusBadge } from '@/components/ui/status-badge';

export function WorkspaceHeader({
  detail,
  readOnlyReason,
}: {
  detail: PackageDetail;
  readOnlyReason: string | null;
}) {
  const pkg = detail.package;
  return (
    <>
      <header className="flex flex-wrap items-center gap-x-3 gap-y-1 border-b-2 border-ink pb-1.5">
        <Link
          to={`/packages/${pkg.id}`}
          className="text-[13px] font-bold text-verdigris underline underline-offset-2"
        >
          ← Package
        </Link>
        <span className="font-mono text-[13px] font-bold text-ink-soft">{pkg.reference}</span>
        <h1 className="min-w-0 truncate text-[18px] font-black leading-tight">{pkg.title}</h1>
        <span className="text-[13px] text-ink-soft">Revision {detail.current.number}</span>
        <StatusBadge status={pkg.status} />
        {pkg.decision && <span className="text-[13px] font-bold">{DECISION_LABELS[pkg.decision]}</span>}
        <span className="ml-auto text-[12.5px] text-ink-soft">
          Engineer of record: <strong className="text-ink">{pkg.engineer?.name ?? 'not assigned'}</strong>
        </span>
      </header>
      {readOnlyReason && (
        <p
          role="note"
          data-testid="read-only-note"
          className="border-b border-rule bg-sheet-alt px-3 py-1 text-[12.5px]"
        >
          <span aria-hidden="true" className="mr-1 font-black">
            ◇
          </span>
          {readOnlyReason}
        </p>
      )}
    </>
  );
}

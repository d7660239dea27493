// The engineer column of the coordinator's queue: the engineer of record, and a quick way
// to assign one to this package alone. Packages that cannot take an engineer (drafts,
// decided, returned) show the name only.
import { actionAllowed } from '@shared/rules/package-status';
import type { PackageSummary } from '@shared/schemas/packages';
import { Spinner } from '@/components/ui/page-loading';
import { explainAssignError, useAssignEngineer } from '../api/assign-engineer';
import type { Engineer } from '@shared/schemas/reviews';

export function EngineerPicker({
  pkg,
  engineers,
}: {
  pkg: PackageSummary;
  engineers: Engineer[] | undefined;
}) {
  const assign = useAssignEngineer();
  if (!actionAllowed('assign_engineer', pkg.status) || !engineers) {
    return pkg.engineer ? (
      <span>{pkg.engineer.name}</span>
    ) : (
      <span className="text-ink-soft">Unassigned</span>
    );
  }
  return (
    // Clicks and keys here choose an engineer; they must not open the package.
    <span className="flex flex-col items-start gap-0.5" onClick={(event) => event.stopPropagation()}>
      <span className="inline-flex items-center gap-1">
        <select
          aria-label={`Engineer of record for ${pkg.reference}`}
          tabIndex={-1}
          value={pkg.engineer?.id ?? ''}
          disabled={assign.isPending}
          onChange={(event) => {
            if (event.target.value) assign.mutate({ packageIds: [pkg.id], engineerId: event.target.value });
          }}
          className={`-ml-1 h-7 max-w-[10.5rem] rounded-[3px] border border-transparent bg-transparent px-0.5 text-[13.5px] hover:border-rule-strong focus:border-rule-strong ${
            pkg.engineer ? 'text-ink' : 'text-ink-soft italic'
          }`}
        >
          {!pkg.engineer && <option value="">Unassigned</option>}
          {pkg.engineer && !engineers.some((e) => e.id === pkg.engineer?.id) && (
            <option value={pkg.engineer.id}>{pkg.engineer.name}</option>
          )}
          {engineers.map((e) => (
            <option key={e.id} value={e.id}>
              {e.name}
            </option>
          ))}
        </select>
        {assign.isPending && <Spinner className="size-3.5" />}
      </span>
      {assign.isError && (
        <span role="alert" className="max-w-[14rem] text-[12px] font-bold text-fail-ink">
          {explainAssignError(assign.error, (id) => (id === pkg.id ? pkg.reference : undefined))}
        </span>
      )}
    </span>
  );
}

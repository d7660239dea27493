// What to do with the ticked packages: assign (or reassign) one engineer of record to all
// of them at once. Says how many are ticked, how loaded each engineer already is, and
// what happened — or why nothing did.
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import { plural } from '@/lib/format';
import { explainAssignError, useAssignEngineer } from '../api/assign-engineer';
import type { Engineer } from '@shared/schemas/reviews';

export function AssignBar({
  selected,
  onClear,
  onAssigned,
  engineers,
  referenceOf,
}: {
  selected: ReadonlySet<string>;
  onClear: () => void;
  onAssigned: () => void;
  engineers: Engineer[] | undefined;
  referenceOf: (id: string) => string | undefined;
}) {
  const [engineerId, setEngineerId] = useState('');
  const [done, setDone] = useState<string | null>(null);
  const assign = useAssignEngineer();
  const count = selected.size;

  if (count === 0 && !done && !assign.isError) return null;

  return (
    <div
      role="region"
      aria-label="Selected packages"
      className="mb-2 flex flex-wrap items-center gap-x-3 gap-y-1.5 border border-ink bg-sheet px-3 py-2 text-[13.5px]"
    >
      {count > 0 && (
        <>
          <strong className="tabular">{plural(count, 'package')} selected</strong>
          <form
            className="flex flex-wrap items-center gap-2"
            onSubmit={(event) => {
              event.preventDefault();
              if (!engineerId) return;
              setDone(null);
              const ids = [...selected];
              assign.mutate(
                { packageIds: ids, engineerId },
                {
                  onSuccess: (result) => {
                    setDone(
                      `${result.engineer.name} is now the engineer of record for ${plural(result.assigned, 'package')}.`,
                    );
                    onAssigned();
                  },
                },
              );
            }}
          >
            <label className="flex items-center gap-1.5">
              <span>Assign to</span>
              <select
                value={engineerId}
                onChange={(event) => setEngineerId(event.target.value)}
                className="h-8 min-w-[15rem] rounded-[3px] border border-rule-strong bg-sheet px-1.5"
              >
                <option value="">Choose an engineer of record…</option>
                {(engineers ?? []).map((e) => (
                  <option key={e.id} value={e.id}>
                    {e.name} — {plural(e.openPackages, 'open package')}
                  </option>
                ))}
              </select>
            </label>
            <Button type="submit" size="sm" variant="primary" disabled={!engineerId || assign.isPending}>
              {assign.isPending ? (
                <>
                  <Spinner className="size-3.5" /> Assigning…
                </>
              ) : (
                'Assign'
              )}
            </Button>
            <Button size="sm" variant="quiet" onClick={onClear}>
              Clear selection
            </Button>
          </form>
        </>
      )}
      <div aria-live="polite" className="basis-full empty:hidden">
        {done && !assign.isError && <p className="font-bold text-pass-ink">✓ {done}</p>}
        {assign.isError && (
          <p role="alert" className="font-bold text-fail-ink">
            {explainAssignError(assign.error, referenceOf)}
          </p>
        )}
      </div>
    </div>
  );
}

// The package page's engineer of record, for the coordinator: assign or reassign from here
// as well as from the queue, with an optional note to the engineer and a confirmation that
// says who is told; each engineer's open work beside their name; and who has held the
// package before. Engineers and administrators see the history only.
import { useState } from 'react';
import { actionAllowed } from '@shared/rules/package-status';
import type { PackageStatus } from '@shared/schemas/common';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { formatDateTime, plural } from '@/lib/format';
import { explainAssignError, useAssignEngineer } from '../api/assign-engineer';
import { useAssignmentHistory } from '../api/get-assignments';
import { useEngineers } from '../api/get-engineers';

const NOTE_LIMIT = 500;

export function AssignPanel({
  pkg,
  canAssign,
}: {
  pkg: {
    id: string;
    reference: string;
    status: PackageStatus;
    engineer: { id: string; name: string } | null;
  };
  canAssign: boolean;
}) {
  const assignable = canAssign && actionAllowed('assign_engineer', pkg.status);
  const engineers = useEngineers({ enabled: assignable });
  const history = useAssignmentHistory(pkg.id);
  const assign = useAssignEngineer();
  const [engineerId, setEngineerId] = useState('');
  const [note, setNote] = useState('');
  const [confirming, setConfirming] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const chosen = engineers.data?.items.find((e) => e.id === engineerId);
  const current = pkg.engineer;

  return (
    <section aria-labelledby="assign-title" className="border border-rule bg-sheet">
      <h2 id="assign-title" className="border-b border-rule px-3 py-2 text-[14px] font-bold">
        Engineer of record
      </h2>
      <div className="flex flex-col gap-2 px-3 py-2.5 text-[13px]">
        <p>
          {current ? (
            <>
              <strong>{current.name}</strong> holds this package.
            </>
          ) : (
            <span className="text-ink-soft">No engineer of record yet.</span>
          )}
        </p>
        {assignable && (
          <form
            className="flex flex-col gap-2"
            onSubmit={(event) => {
              event.preventDefault();
              if (chosen) setConfirming(true);
            }}
          >
            <label className="flex flex-col gap-1">
              <span className="font-bold">{current ? 'Reassign to' : 'Assign to'}</span>
              <select
                value={engineerId}
                onChange={(event) => setEngineerId(event.target.value)}
                className="h-8 rounded-[3px] border border-rule-strong bg-sheet px-1.5"
              >
                <option value="">Choose an engineer of record…</option>
                {(engineers.data?.items ?? [])
                  .filter((e) => e.id !== current?.id)
                  .map((e) => (
                    <option key={e.id} value={e.id}>
                      {e.name} — {plural(e.openPackages, 'open package')}
                    </option>
                  ))}
              </select>
            </label>
            <label className="flex flex-col gap-1">
              <span className="font-bold">
                Note to the engineer <span className="font-normal text-ink-soft">(optional)</span>
              </span>
              <textarea
                value={note}
                maxLength={NOTE_LIMIT}
                rows={2}
                onChange={(event) => setNote(event.target.value)}
                className="rounded-[3px] border border-rule-strong bg-sheet px-1.5 py-1"
              />
              <span className="text-[12px] text-ink-soft tabular">
                {note.length} of {NOTE_LIMIT} characters; sent with the assignment e-mail.
              </span>
            </label>
            <div>
              <Button type="submit" size="sm" variant="primary" disabled={!chosen || assign.isPending}>
                {current ? 'Reassign…' : 'Assign…'}
              </Button>
            </div>
          </form>
        )}
        <div aria-live="polite" className="empty:hidden">
          {done && !assign.isError && <p className="font-bold text-pass-ink">✓ {done}</p>}
          {assign.isError && (
            <p role="alert" className="font-bold text-fail-ink">
              {explainAssignError(assign.error, (id) => (id === pkg.id ? pkg.reference : undefined))}
            </p>
          )}
        </div>
        <h3 className="mt-1 text-[12px] font-bold uppercase tracking-[0.05em] text-ink-soft">
          Assignment history
        </h3>
        {history.data && history.data.items.length === 0 && (
          <p className="text-ink-soft">Not assigned yet.</p>
        )}
        {history.isError && <p className="text-fail-ink">The history could not be loaded.</p>}
        {history.data && history.data.items.length > 0 && (
          <ol className="flex flex-col gap-1.5">
            {history.data.items.map((a) => (
              <li key={a.id} className="border-l-2 border-rule-strong pl-2">
                <p>
                  <strong>{a.engineer}</strong>, assigned by {a.assignedBy}
                </p>
                <p className="text-[12px] text-ink-soft tabular">
                  {formatDateTime(a.assignedAt)}
                  {a.endedAt ? ` to ${formatDateTime(a.endedAt)}` : ' · current'}
                </p>
                {a.note && <p className="whitespace-pre-wrap break-words">“{a.note}”</p>}
              </li>
            ))}
          </ol>
        )}
      </div>
      {confirming && chosen && (
        <Dialog
          title={
            current
              ? `Reassign ${pkg.reference} to ${chosen.name}?`
              : `Assign ${pkg.reference} to ${chosen.name}?`
          }
          description={
            current
              ? `${current.name} stops being the engineer of record and loses the package from their list. ${chosen.name} (${plural(chosen.openPackages, 'open package')}) is told by e-mail.`
              : `${chosen.name} (${plural(chosen.openPackages, 'open package')}) becomes the engineer of record and is told by e-mail.`
          }
          onClose={() => setConfirming(false)}
        >
          {note.trim() && (
            <p className="mb-3 text-[13px]">
              With your note: <span className="whitespace-pre-wrap break-words">“{note.trim()}”</span>
            </p>
          )}
          <div className="flex justify-end gap-2">
            <Button size="sm" variant="quiet" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
            <Button
              size="sm"
              variant="primary"
              disabled={assign.isPending}
              onClick={() =>
                assign.mutate(
                  {
                    packageIds: [pkg.id],
                    engineerId: chosen.id,
                    ...(note.trim() ? { note: note.trim() } : {}),
                  },
                  {
                    onSuccess: (result) => {
                      setDone(`${result.engineer.name} is now the engineer of record for ${pkg.reference}.`);
                      setEngineerId('');
                      setNote('');
                    },
                    onSettled: () => setConfirming(false),
                  },
                )
              }
            >
              {assign.isPending
                ? 'Assigning…'
                : current
                  ? `Reassign to ${chosen.name}`
                  : `Assign ${chosen.name}`}
            </Button>
          </div>
        </Dialog>
      )}
    </section>
  );
}

// Everyone with an account or an invitation: role changes in place, a fresh invitation
// link, and deactivation after a confirmation that says what it does (sessions end, the
// history stays). The administrator cannot demote or deactivate themselves here, so the
// desk is never left without anyone to run it by accident.
import { useState } from 'react';
import { ROLES, type Role } from '@shared/schemas/common';
import { isApiError } from '@/lib/api-client';
import { formatDate } from '@/lib/format';
import { ROLE_LABELS } from '@/lib/roles';
import { Button } from '@/components/ui/button';
import { useReinvitePerson, useUpdatePerson, type Person } from '../api/people';
import { InviteLinkOnce } from './invite-link-once';
import { PERSON_STATE_LABELS } from '../lib/labels';
import { AdminTable, type AdminColumn } from './admin-table';
import { ConfirmDialog } from './confirm-dialog';

const STATE_STYLES: Record<Person['state'], string> = {
  active: 'border-decided-edge bg-decided-tint text-decided-ink',
  invited: 'border-ready-edge bg-ready-tint text-ready-ink',
  invite_expired: 'border-caution-ink/40 bg-caution-tint text-caution-ink',
  deactivated: 'border-draft-edge border-dashed bg-draft-tint text-draft-ink',
};

function StateShape({ state }: { state: Person['state'] }) {
  const common = {
    className: 'size-3',
    viewBox: '0 0 12 12',
    'aria-hidden': true,
    fill: 'none',
    stroke: 'currentColor',
    strokeWidth: 1.5,
  } as const;
  switch (state) {
    case 'active': // a filled disc: can sign in
      return (
        <svg {...common}>
          <circle cx="6" cy="6" r="4.5" fill="currentColor" stroke="none" />
        </svg>
      );
    case 'invited': // an envelope: the link is out
      return (
        <svg {...common}>
          <rect x="1" y="2.5" width="10" height="7" />
          <path d="M1 2.5 L6 6.5 L11 2.5" />
        </svg>
      );
    case 'invite_expired': // an hourglass: the link ran out
      return (
        <svg {...common}>
          <path d="M2.5 1 H9.5 L2.5 11 H9.5 Z" />
        </svg>
      );
    case 'deactivated': // a barred ring: no access
      return (
        <svg {...common}>
          <circle cx="6" cy="6" r="4.5" />
          <path d="M2.8 9.2 L9.2 2.8" />
        </svg>
      );
  }
}

export function PersonState({ state }: { state: Person['state'] }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-sm border px-1.5 text-[12.5px] font-bold leading-5 ${STATE_STYLES[state]}`}
    >
      <StateShape state={state} />
      {PERSON_STATE_LABELS[state]}
    </span>
  );
}

function RoleCell({ person, isSelf }: { person: Person; isSelf: boolean }) {
  const update = useUpdatePerson();
  const allowed: readonly Role[] =
    person.organisation.kind === 'contractor'
      ? ['contractor']
      : ROLES.filter((role) => role !== 'contractor');
  const options = allowed.includes(person.role) ? allowed : [person.role, ...allowed];
  const locked = isSelf || person.state === 'deactivated' || options.length < 2;
  return (
    <div className="flex flex-col gap-0.5">
      {locked ? (
        <span>{ROLE_LABELS[person.role]}</span>
      ) : (
        <select
          aria-label={`Role of ${person.name}`}
          value={person.role}
          disabled={update.isPending}
          onChange={(event) => update.mutate({ id: person.id, body: { role: event.target.value as Role } })}
          className="h-7 max-w-[190px] rounded-[3px] border border-rule-strong bg-sheet px-1.5 text-[13.5px]"
        >
          {options.map((role) => (
            <option key={role} value={role}>
              {ROLE_LABELS[role]}
            </option>
          ))}
        </select>
      )}
      {update.isError && (
        <span role="alert" className="text-[12.5px] font-bold text-failed-ink">
          {update.error.message}
        </span>
      )}
      {update.isSuccess && (
        <span role="status" className="text-[12.5px] text-pass-ink">
          Role changed
        </span>
      )}
    </div>
  );
}

function Actions({
  person,
  isSelf,
  onDeactivate,
}: {
  person: Person;
  isSelf: boolean;
  onDeactivate: () => void;
}) {
  const reinvite = useReinvitePerson();
  const reactivate = useUpdatePerson();
  const canReinvite = person.state === 'invited' || person.state === 'invite_expired';
  return (
    <div className="flex flex-col items-end gap-0.5">
      <div className="flex items-center justify-end gap-1">
        {canReinvite && (
          <Button
            size="sm"
            variant="quiet"
            disabled={reinvite.isPending}
            onClick={() => reinvite.mutate(person.id)}
            aria-label={`Send new link to ${person.name}`}
          >
            {reinvite.isPending ? 'Sending…' : 'Send new link'}
          </Button>
        )}
        {person.state === 'deactivated' ? (
          <Button
            size="sm"
            variant="quiet"
            disabled={reactivate.isPending}
            onClick={() => reactivate.mutate({ id: person.id, body: { active: true } })}
            aria-label={`Reactivate ${person.name}`}
          >
            Reactivate
          </Button>
        ) : (
          !isSelf && (
            <Button size="sm" onClick={onDeactivate} aria-label={`Deactivate ${person.name}`}>
              Deactivate
            </Button>
          )
        )}
      </div>
      {reinvite.isSuccess && (
        <span role="status" className="max-w-[26rem] text-right text-[12.5px] text-pass-ink">
          New link sent; the old one no longer works
          <InviteLinkOnce link={reinvite.data.inviteLink} />
        </span>
      )}
      {(reinvite.error ?? reactivate.error) && (
        <span role="alert" className="text-[12.5px] font-bold text-failed-ink">
          {(reinvite.error ?? reactivate.error)!.message}
        </span>
      )}
    </div>
  );
}

const COLUMNS: AdminColumn[] = [
  { label: 'Person' },
  { label: 'Organisation' },
  { label: 'Role' },
  { label: 'State' },
  { label: 'Added' },
  { label: 'Actions', hidden: true },
];

export function PeopleTable({ people, currentUserId }: { people: Person[]; currentUserId: string }) {
  const [deactivating, setDeactivating] = useState<Person | null>(null);
  const deactivate = useUpdatePerson();

  return (
    <>
      <AdminTable caption="People" columns={COLUMNS}>
        {people.map((person) => {
          const isSelf = person.id === currentUserId;
          return (
            <tr
              key={person.id}
              className={`border-b border-rule align-top last:border-b-0 ${person.state === 'deactivated' ? 'text-ink-soft' : ''}`}
            >
              <td className="px-3 py-2">
                <span className="block font-bold text-ink">
                  {person.name}
                  {isSelf && <span className="ml-1.5 text-[12px] font-normal text-ink-soft">(you)</span>}
                </span>
                <span className="block text-[12.5px] text-ink-soft">{person.email}</span>
              </td>
              <td className="px-3 py-2">{person.organisation.name}</td>
              <td className="px-3 py-2">
                <RoleCell person={person} isSelf={isSelf} />
              </td>
              <td className="px-3 py-2">
                <PersonState state={person.state} />
              </td>
              <td className="tabular whitespace-nowrap px-3 py-2">{formatDate(person.createdAt)}</td>
              <td className="px-3 py-2">
                <Actions person={person} isSelf={isSelf} onDeactivate={() => setDeactivating(person)} />
              </td>
            </tr>
          );
        })}
      </AdminTable>
      {deactivating && (
        <ConfirmDialog
          title={`Deactivate ${deactivating.name}?`}
          confirmLabel="Deactivate"
          pendingLabel="Deactivating…"
          pending={deactivate.isPending}
          error={
            deactivate.error ? (isApiError(deactivate.error) ? deactivate.error.message : 'Try again.') : null
          }
          onClose={() => {
            deactivate.reset();
            setDeactivating(null);
          }}
          onConfirm={() =>
            deactivate.mutate(
              { id: deactivating.id, body: { active: false } },
              { onSuccess: () => setDeactivating(null) },
            )
          }
        >
          <p>
            {deactivating.name} ({deactivating.email}) will be signed out everywhere at once and can no longer
            sign in.
          </p>
          <p>
            Everything they did stays: their packages, findings, markups and decisions keep their name.
            Packages assigned to them stay assigned until a coordinator reassigns them. You can reactivate the
            account later.
          </p>
        </ConfirmDialog>
      )}
    </>
  );
}

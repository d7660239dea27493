// /admin/people — everyone on the desk, filtered by organisation, role and state (kept in
// the URL), with the invitation dialog.
import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ROLES } from '@shared/schemas/common';
import { useCurrentUser } from '@/lib/auth';
import { ROLE_LABELS } from '@/lib/roles';
import { PageHeader } from '@/components/layouts/page-header';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/panel-message';
import { useOrganisations } from '@/features/admin/api/organisations';
import { usePeople, type InvitedPerson } from '@/features/admin/api/people';
import type { PeopleFilters } from '@/lib/query-keys';
import { ListStates } from '@/features/admin/components/admin-table';
import { InviteDialog } from '@/features/admin/components/invite-dialog';
import { InviteLinkOnce } from '@/features/admin/components/invite-link-once';
import { PeopleTable } from '@/features/admin/components/people-table';
import { PERSON_STATE_LABELS } from '@/features/admin/lib/labels';

/** One filter of the list: "All" or one of `options` (value, label), kept in the URL by the caller. */
function FilterSelect({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: string | undefined;
  options: readonly (readonly [string, string])[];
  onChange: (value: string) => void;
}) {
  return (
    <label className="flex items-center gap-1.5">
      <span className="font-bold">{label}</span>
      <select
        className="h-8 rounded-[3px] border border-rule-strong bg-sheet px-1.5 text-[13.5px] text-ink"
        value={value ?? ''}
        onChange={(event) => onChange(event.target.value)}
      >
        <option value="">All</option>
        {options.map(([optionValue, optionLabel]) => (
          <option key={optionValue} value={optionValue}>
            {optionLabel}
          </option>
        ))}
      </select>
    </label>
  );
}

export default function AdminPeopleRoute() {
  const { data: user } = useCurrentUser();
  const [params, setParams] = useSearchParams();
  const filters: PeopleFilters = {
    organisationId: params.get('organisationId') || undefined,
    role: params.get('role') || undefined,
    state: params.get('state') || undefined,
  };
  const people = usePeople(filters);
  const organisations = useOrganisations();
  const [inviting, setInviting] = useState(false);
  const [invited, setInvited] = useState<InvitedPerson | null>(null);

  const setFilter = (key: keyof PeopleFilters, value: string) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        if (value) next.set(key, value);
        else next.delete(key);
        return next;
      },
      { replace: true },
    );

  const filtered = Boolean(filters.organisationId || filters.role || filters.state);
  if (!user) return null;

  return (
    <>
      <PageHeader
        title="People"
        context="Invite people by e-mail, change their role, or deactivate an account. History stays with the person."
        actions={
          <Button
            variant="primary"
            disabled={!organisations.data?.items.length}
            onClick={() => {
              setInvited(null);
              setInviting(true);
            }}
          >
            Invite a person
          </Button>
        }
      />
      <div role="group" aria-label="Filters" className="mb-3 flex flex-wrap items-center gap-3 text-[13.5px]">
        <FilterSelect
          label="Organisation"
          value={filters.organisationId}
          options={(organisations.data?.items ?? []).map((org) => [org.id, org.name] as const)}
          onChange={(value) => setFilter('organisationId', value)}
        />
        <FilterSelect
          label="Role"
          value={filters.role}
          options={ROLES.map((role) => [role, ROLE_LABELS[role]] as const)}
          onChange={(value) => setFilter('role', value)}
        />
        <FilterSelect
          label="State"
          value={filters.state}
          options={Object.entries(PERSON_STATE_LABELS)}
          onChange={(value) => setFilter('state', value)}
        />
        {filtered && (
          <Button size="sm" variant="quiet" onClick={() => setParams({}, { replace: true })}>
            Clear filters
          </Button>
        )}
        {people.data && (
          <span className="ml-auto text-ink-soft tabular" aria-live="polite">
            {people.data.items.length} {people.data.items.length === 1 ? 'person' : 'people'}
          </span>
        )}
      </div>

      {invited && (
        <div role="status" className="mb-3 border-l-4 border-verdigris bg-verdigris-tint px-3 py-2 text-sm">
          <strong>Invitation queued for {invited.email}.</strong> It expires if not used.
          <InviteLinkOnce link={invited.inviteLink} />
        </div>
      )}

      <ListStates
        query={people}
        loading="Loading people"
        failed="People could not be loaded"
        isEmpty={(data) => data.items.length === 0}
        empty={
          <EmptyState title={filtered ? 'Nobody matches these filters' : 'Nobody on the desk yet'}>
            <p>
              {filtered
                ? 'Clear a filter to see more people.'
                : 'Invite the first coordinator or engineer of record.'}
            </p>
          </EmptyState>
        }
      >
        {(data) => <PeopleTable people={data.items} currentUserId={user.id} />}
      </ListStates>

      {inviting && organisations.data && (
        <InviteDialog
          organisations={organisations.data.items}
          initialOrganisationId={filters.organisationId}
          onClose={() => setInviting(false)}
          onInvited={(person) => {
            setInviting(false);
            setInvited(person);
          }}
        />
      )}
    </>
  );
}

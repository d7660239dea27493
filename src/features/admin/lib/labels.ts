// Plain names for the admin pages' enumerations.
import type { OrganisationKind } from '@shared/schemas/common';
import type { Person } from '@shared/schemas/admin';

export const ORGANISATION_KIND_LABELS: Record<OrganisationKind, string> = {
  contractor: 'Lifting contractor',
  owner: 'Site owner',
};

export const PERSON_STATE_LABELS: Record<Person['state'], string> = {
  active: 'Active',
  invited: 'Invited',
  invite_expired: 'Invitation expired',
  deactivated: 'Deactivated',
};

export const MAIL_EVENT_LABELS: Record<string, string> = {
  submitted: 'Package submitted',
  assigned: 'Engineer assigned',
  returned: 'Decision returned',
  resubmitted: 'Package resubmitted',
  reminder: 'Lift date reminder',
  invite: 'Invitation',
};

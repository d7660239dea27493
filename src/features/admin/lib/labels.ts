// Plain names for the admin pages' enumerations.
import type { OrganisationKind } from '@shared/schemas/common';
import type { MAIL_EVENTS, Person } from '@shared/schemas/admin';

type MailEvent = (typeof MAIL_EVENTS)[number];

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

export const MAIL_EVENT_LABELS: Record<MailEvent, string> = {
  submitted: 'Package submitted',
  assigned: 'Engineer assigned',
  decided: 'Decision recorded',
  returned: 'Decision returned',
  answered: 'Finding answered',
  resubmitted: 'Package resubmitted',
  reminder: 'Lift date reminder',
  review_due: 'Review due reminder',
  invite: 'Invitation',
};

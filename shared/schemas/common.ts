// Names shared by client, server and worker: roles, package statuses, decisions and the
// one JSON error shape every API error uses.
import { z } from 'zod';

export const ROLES = ['contractor', 'reviewer', 'engineer', 'admin'] as const;
export const Role = z.enum(ROLES);
export type Role = z.infer<typeof Role>;

export const ORGANISATION_KINDS = ['contractor', 'owner'] as const;
export const OrganisationKind = z.enum(ORGANISATION_KINDS);
export type OrganisationKind = z.infer<typeof OrganisationKind>;

export const UNIT_SYSTEMS = ['metric', 'imperial'] as const;
export const UnitSystem = z.enum(UNIT_SYSTEMS);
export type UnitSystem = z.infer<typeof UnitSystem>;

/** Where a lift package stands. Plain words of our own; the decision values are the trade's. */
export const PACKAGE_STATUSES = [
  'draft',
  'checking',
  'check_failed',
  'ready_for_review',
  'with_engineer',
  'decided',
  'returned',
] as const;
export const PackageStatus = z.enum(PACKAGE_STATUSES);
export type PackageStatus = z.infer<typeof PackageStatus>;

export const PACKAGE_STATUS_LABELS: Record<PackageStatus, string> = {
  draft: 'Draft',
  checking: 'Check running',
  check_failed: 'Check could not run',
  ready_for_review: 'Ready for review',
  with_engineer: 'With engineer',
  decided: 'Decision recorded',
  returned: 'Returned',
};

export const DECISIONS = ['accepted', 'accepted_as_noted', 'revise_and_resubmit', 'rejected'] as const;
export const Decision = z.enum(DECISIONS);
export type Decision = z.infer<typeof Decision>;

export const DECISION_LABELS: Record<Decision, string> = {
  accepted: 'Accepted',
  accepted_as_noted: 'Accepted as noted',
  revise_and_resubmit: 'Revise and resubmit',
  rejected: 'Rejected',
};

export const ErrorField = z.object({ path: z.string(), message: z.string() });
export const ErrorBody = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.array(ErrorField).optional(),
  }),
});
export type ErrorBody = z.infer<typeof ErrorBody>;

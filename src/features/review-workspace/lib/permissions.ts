// Who may do what in the workspace. The statuses come from the shared status machine, the
// same the server asks (shared/rules/package-status.ts); the client only keeps people from
// starting work the server would refuse.
import { actionAllowed } from '@shared/rules/package-status';
import type { CurrentUser } from '@shared/schemas/auth';
import { PACKAGE_STATUS_LABELS } from '@shared/schemas/common';
import type { PackageDetail } from '@shared/schemas/packages';
import { ROLE_LABELS } from '@/lib/roles';

export type WorkspaceAccess = {
  assigned: boolean;
  /** Markups, findings and accepted figures: only while the package is with the engineer. */
  canMarkUp: boolean;
  /** The decision can still change after it is recorded, until the return is issued. */
  canDecide: boolean;
  /** Closing and reopening findings. */
  canChangeFindings: boolean;
  /** Why the workspace is read-only (or partly), in a sentence; null when everything is open. */
  reason: string | null;
};

export function workspaceAccess(user: CurrentUser, detail: PackageDetail): WorkspaceAccess {
  const pkg = detail.package;
  const assigned = user.role === 'engineer' && pkg.engineer?.id === user.id;
  const canMarkUp = assigned && actionAllowed('edit_markups', pkg.status);
  const canDecide = assigned && actionAllowed('record_decision', pkg.status);
  let reason: string | null = null;
  if (user.role !== 'engineer') {
    reason = `Read-only: you are signed in as ${ROLE_LABELS[user.role].toLowerCase()}. Only the engineer of record assigned to this package marks it up and decides.`;
  } else if (!assigned) {
    reason = pkg.engineer
      ? `Read-only: this package is assigned to ${pkg.engineer.name}.`
      : 'Read-only: no engineer of record is assigned to this package yet.';
  } else if (pkg.status === 'decided') {
    reason =
      'A decision is recorded: markups and findings are closed. You can still change the decision until the coordinator issues the return.';
  } else if (!canDecide) {
    reason = `Read-only: the package is ${PACKAGE_STATUS_LABELS[pkg.status].toLowerCase()}.`;
  }
  const canChangeFindings = assigned && actionAllowed('close_or_reopen_finding', pkg.status);
  return { assigned, canMarkUp, canDecide, canChangeFindings, reason };
}

// Who may do what in the workspace. The statuses come from the shared status machine, the
// same the server asks (shared/rules/package-status.ts), and so does the rule that a requested
// return fixes the revision's decision, findings and markups; the client only keeps people
// from starting work the server would refuse.
import { actionAllowed, returnRefusal, type PackageAction } from '@shared/rules/package-status';
import type { CurrentUser } from '@shared/schemas/auth';
import { PACKAGE_STATUS_LABELS } from '@shared/schemas/common';
import type { PackageDetail } from '@shared/schemas/packages';
import { ROLE_LABELS } from '@/lib/roles';

export type WorkspaceAccess = {
  assigned: boolean;
  /** Markups, findings and accepted figures: only while the package is with the engineer. */
  canMarkUp: boolean;
  /** The decision can still change after it is recorded, until the return is requested. */
  canDecide: boolean;
  /** Closing and reopening findings. */
  canChangeFindings: boolean;
  /** Dragging the stamp block's outline on page 1: like the decision, until the return is requested. */
  canPlaceStamp: boolean;
  /** Why the workspace is read-only (or partly), in a sentence; null when everything is open. */
  reason: string | null;
};

export function workspaceAccess(user: CurrentUser, detail: PackageDetail): WorkspaceAccess {
  const pkg = detail.package;
  const assigned = user.role === 'engineer' && pkg.engineer?.id === user.id;
  const returnRequested = detail.current.returnRequestedAt !== null;
  const allowed = (action: PackageAction) =>
    assigned &&
    actionAllowed(action, pkg.status) &&
    returnRefusal(action, returnRequested, detail.current.number, '') === null;
  const canMarkUp = allowed('edit_markups');
  const canDecide = allowed('record_decision');
  let reason: string | null = null;
  if (user.role !== 'engineer') {
    reason = `Read-only: you are signed in as ${ROLE_LABELS[user.role].toLowerCase()}. Only the engineer of record assigned to this package marks it up and decides.`;
  } else if (!assigned) {
    reason = pkg.engineer
      ? `Read-only: this package is assigned to ${pkg.engineer.name}.`
      : 'Read-only: no engineer of record is assigned to this package yet.';
  } else if (returnRequested) {
    reason = `The stamped return of revision ${detail.current.number} has been issued: its decision, findings and markups stay as issued.`;
  } else if (pkg.status === 'decided') {
    reason =
      'A decision is recorded: markups and findings are closed. You can still change the decision until the coordinator issues the return.';
  } else if (!canDecide) {
    reason = `Read-only: the package is ${PACKAGE_STATUS_LABELS[pkg.status].toLowerCase()}.`;
  }
  const canChangeFindings = allowed('close_or_reopen_finding');
  const canPlaceStamp = allowed('place_stamp');
  return { assigned, canMarkUp, canDecide, canChangeFindings, canPlaceStamp, reason };
}

// The package status machine: which status may follow which, who makes each move, and which
// actions a package allows in each status. Services ask it before they change anything (a
// wrong-state action answers 409 with the message below); the client asks it to decide what
// to offer. Statuses: draft → checking (check_failed) → ready_for_review → with_engineer →
// decided → returned; a return as Revise and resubmit or Rejected lets the contractor start
// the next revision (draft again).
import type { PackageStatus, Role } from '../schemas/common';

type Mover = Role | 'system';

export const TRANSITIONS: Record<PackageStatus, Partial<Record<PackageStatus, readonly Mover[]>>> = {
  draft: { checking: ['contractor'] },
  checking: { ready_for_review: ['system'], check_failed: ['system'] },
  check_failed: { checking: ['contractor', 'reviewer'] },
  ready_for_review: { with_engineer: ['reviewer'] },
  with_engineer: { with_engineer: ['reviewer'], decided: ['engineer'] },
  decided: { returned: ['engineer', 'system'] },
  returned: { draft: ['contractor'] },
};

/** Whether `by` may move a package from `from` to `to`. */
export function canMove(from: PackageStatus, to: PackageStatus, by: Mover): boolean {
  return TRANSITIONS[from]?.[to]?.includes(by) ?? false;
}

export type PackageAction =
  | 'edit_draft'
  | 'answer_finding'
  | 'raise_finding'
  | 'close_or_reopen_finding'
  | 'edit_markups'
  | 'place_stamp'
  | 'accept_figure'
  | 'record_decision'
  | 'issue_return'
  | 'assign_engineer'
  | 'start_next_revision';

/** The statuses in which each action is allowed, and the words that say so. */
export const ACTION_STATES: Record<PackageAction, { states: readonly PackageStatus[]; when: string }> = {
  edit_draft: { states: ['draft'], when: 'while the package is a draft' },
  // The contractor answers once the package is back with them: returned, or the next draft.
  answer_finding: {
    states: ['returned', 'draft'],
    when: 'once the package has been returned to the contractor',
  },
  raise_finding: { states: ['with_engineer'], when: 'while the package is with the engineer' },
  // The engineer settles findings until the return is requested (see fixedByReturn).
  close_or_reopen_finding: {
    states: ['with_engineer', 'decided'],
    when: 'while the package is with the engineer, before the return',
  },
  edit_markups: { states: ['with_engineer'], when: 'while the package is with the engineer' },
  // Where the stamp goes is part of what the return is built from: open until it is requested.
  place_stamp: {
    states: ['with_engineer', 'decided'],
    when: 'while the package is with the engineer, before the return',
  },
  accept_figure: { states: ['with_engineer'], when: 'while the package is with the engineer' },
  // The engineer may change the decision until the return is requested (see fixedByReturn).
  record_decision: {
    states: ['with_engineer', 'decided'],
    when: 'while the package is with the engineer, before the return',
  },
  // Issuing again once returned gives back the same return.
  issue_return: { states: ['decided', 'returned'], when: 'once the engineer has recorded a decision' },
  // A reviewer assigns (or reassigns) the engineer any time between submission and the decision.
  assign_engineer: {
    states: ['checking', 'check_failed', 'ready_for_review', 'with_engineer'],
    when: 'between submission and the decision',
  },
  // Only after a return as Revise and resubmit or Rejected (the decision is checked as well).
  start_next_revision: { states: ['returned'], when: 'after the package is returned' },
};

export function actionAllowed(action: PackageAction, status: PackageStatus): boolean {
  return ACTION_STATES[action].states.includes(status);
}

/**
 * Once the stamped return of a revision is requested, the engineer's record of that revision
 * is fixed whatever the status: the return is built from exactly the decision, findings and
 * markups it was issued for, so the PDF, the package page and /verify agree.
 */
const FIXED_ONCE_RETURN_REQUESTED: ReadonlySet<PackageAction> = new Set<PackageAction>([
  'record_decision',
  'raise_finding',
  'close_or_reopen_finding',
  'edit_markups',
  'place_stamp',
  'accept_figure',
]);

/** Whether the action is one the requested return of the current revision closes. */
function fixedByReturn(action: PackageAction): boolean {
  return FIXED_ONCE_RETURN_REQUESTED.has(action);
}

/**
 * Null when the action may go on although a return is requested (or none is), otherwise the
 * sentence to answer with (409 `return_issued`).
 */
export function returnRefusal(
  action: PackageAction,
  returnRequested: boolean,
  revision: number,
  what: string,
): string | null {
  if (!returnRequested || !fixedByReturn(action)) return null;
  return `${what} only before the stamped return is issued; the return of revision ${revision} has been issued, so its decision, findings and markups stay as issued.`;
}

/** Null when the action is allowed in this status, otherwise the sentence to answer with. */
export function stateRefusal(action: PackageAction, status: PackageStatus, what: string): string | null {
  if (actionAllowed(action, status)) return null;
  return `${what} only ${ACTION_STATES[action].when}; this package is ${status.replace(/_/g, ' ')}.`;
}

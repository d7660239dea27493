// Every action the audit trail records, with the words the package history shows for it.
// The server's audit service accepts only these names; the client's timeline reads the words.
export const AUDIT_ACTION_WORDS = {
  'package.created': 'Package started',
  'package.deleted': 'Draft package deleted',
  'revision.submitted': 'Revision submitted',
  'revision.started': 'New revision started',
  'check.completed': 'Check completed',
  'check.invalid': 'Check could not run',
  'check.failed': 'Check failed',
  'check.retried': 'Check retried',
  'file.added': 'File added',
  'file.removed': 'File removed',
  'engineer.assigned': 'Engineer of record assigned',
  'engineer.reassigned': 'Engineer of record changed',
  'finding.raised': 'Finding raised',
  'finding.answered': 'Finding answered',
  'finding.closed': 'Finding closed',
  'finding.reopened': 'Finding reopened',
  'figure.accepted': 'Contractor figure accepted',
  'decision.recorded': 'Decision recorded',
  'return.requested': 'Stamped return requested',
  'return.issued': 'Stamped return issued',
  'organisation.created': 'Organisation added',
  'organisation.renamed': 'Organisation renamed',
  'site.created': 'Site added',
  'site.updated': 'Site changed',
  'site.reviewers': 'Site reviewers changed',
  'policy.changed': 'Review policy changed',
  'person.invited': 'Person invited',
  'person.reinvited': 'Invitation sent again',
  'person.updated': 'Person changed',
  'person.joined': 'Person joined',
} as const;

export type AuditAction = keyof typeof AUDIT_ACTION_WORDS;

export const AUDIT_ACTIONS = Object.keys(AUDIT_ACTION_WORDS) as AuditAction[];

export function isAuditAction(value: string): value is AuditAction {
  return Object.prototype.hasOwnProperty.call(AUDIT_ACTION_WORDS, value);
}

/** The history's words for an action; an unknown (older) name is shown as readable text. */
export function auditActionWords(action: string): string {
  return isAuditAction(action)
    ? AUDIT_ACTION_WORDS[action]
    : action.replace(/[._]/g, ' ').replace(/^\w/, (c) => c.toUpperCase());
}

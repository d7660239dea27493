// The typed list of audit actions: the history's words come from it, an older stored name still reads.
import { describe, expect, it } from 'vitest';
import { AUDIT_ACTIONS, auditActionWords, isAuditAction } from '@shared/rules/audit-actions';

describe('audit actions', () => {
  it('when an action is in the list, then the history shows its words', () => {
    expect(auditActionWords('return.issued')).toBe('Stamped return issued');
    expect(isAuditAction('finding.raised')).toBe(true);
  });
  it('when a stored action is not in the list, then it reads as text and is not accepted as an action', () => {
    expect(isAuditAction('check.done')).toBe(false);
    expect(auditActionWords('check.done')).toBe('Check done');
  });
  it('when actions are listed, then every name is resource.verb', () => {
    for (const a of AUDIT_ACTIONS) expect(a).toMatch(/^[a-z]+\.[a-z]+$/);
  });
});

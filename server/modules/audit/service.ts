// The one way anything is written to the audit trail: a named action from the typed list
// (shared/rules/audit-actions.ts), who did it (null for the system: the check worker, a
// migration), the package it concerns (null for desk administration) and a small detail.
import type { EntityManager } from 'typeorm';
import type { AuditAction } from '@shared/rules/audit-actions';
import { AuditEvent } from './audit-event.entity';

/** Who acted: an Actor, or just an id (with its organisation when known); null = the system. */
export interface AuditActor {
  id: string;
  organisationId?: string | null;
}

export interface AuditEntry {
  action: AuditAction;
  actor: AuditActor | null;
  packageId: string | null;
  detail?: Record<string, unknown>;
  /** Defaults to the actor's organisation. */
  organisationId?: string | null;
}

export async function recordAudit(m: EntityManager, entry: AuditEntry): Promise<void> {
  await m.getRepository(AuditEvent).save({
    packageId: entry.packageId,
    actorId: entry.actor?.id ?? null,
    organisationId:
      entry.organisationId !== undefined ? entry.organisationId : (entry.actor?.organisationId ?? null),
    action: entry.action,
    detail: entry.detail ?? {},
  });
}

// The fleet library's audit trail: every change to a crane, configuration, version or a package's
// use of them is recorded against the user's organisation (and the package, when there is one).
import type { Actor } from '@shared/rules/actor';
import type { EntityManager } from 'typeorm';
import { AuditEvent } from '../audit/audit-event.entity';

type U = Actor;

export async function audit(
  m: EntityManager,
  user: U,
  action: string,
  detail: Record<string, unknown>,
  packageId?: string,
) {
  await m.getRepository(AuditEvent).save({
    packageId: packageId ?? null,
    organisationId: user.organisationId,
    actorId: user.id,
    action,
    detail,
  });
}

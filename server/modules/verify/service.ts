// The public verification answer for a stamped return's code: the package title, revision,
// decision, dates, its conditions and any override reason, the return's sha-256, the fingerprint of the certificate that signed it,
// and whether a later revision or return supersedes it. Null when no ready return has the code.
import type { DataSource } from 'typeorm';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { Verification } from '@shared/schemas/reviews';
import { LiftPackage, Revision } from '../packages/package.entity';
import { DecisionRecord, StampedReturn } from '../reviews/review.entity';

export async function verifyReturn(ds: DataSource, code: string): Promise<Verification | null> {
  const ret = await ds.getRepository(StampedReturn).findOneBy({ verificationCode: code, state: 'ready' });
  if (!ret) return null;
  const pkg = await ds.getRepository(LiftPackage).findOneByOrFail({ id: ret.packageId });
  const revision = await ds.getRepository(Revision).findOneByOrFail({ id: ret.revisionId });
  const decision = await ds.getRepository(DecisionRecord).findOneByOrFail({ id: ret.decisionId });
  const later = await ds
    .getRepository(Revision)
    .createQueryBuilder('r')
    .where('r.package_id = :p AND r.number > :n AND r.state = :s', {
      p: pkg.id,
      n: revision.number,
      s: 'submitted',
    })
    .orderBy('r.number', 'DESC')
    .getOne();
  const newerReturn = await ds
    .getRepository(StampedReturn)
    .createQueryBuilder('s')
    .where('s.package_id = :p AND s.state = :ready AND s.id <> :id', {
      p: pkg.id,
      ready: 'ready',
      id: ret.id,
    })
    .andWhere('s.created_at > (SELECT o.created_at FROM stamped_returns o WHERE o.id = :id)', {
      id: ret.id,
    })
    .getCount();
  return {
    found: true,
    reference: pkg.reference,
    title: pkg.title,
    revision: revision.number,
    decision: decision.decision,
    decisionLabel: DECISION_LABELS[decision.decision],
    decidedOn: decision.createdAt.toISOString(),
    issuedOn: (ret.readyAt ?? ret.createdAt).toISOString(),
    conditions: decision.conditions,
    overrideReason: decision.overrideReason,
    sha256: ret.sha256!,
    signingCertificateSha256: ret.signingCertificateSha256,
    current: !later && newerReturn === 0,
    supersededBy: later?.number ?? null,
  };
}

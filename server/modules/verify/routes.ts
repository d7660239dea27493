// The public verification answer for a stamped return's code (no sign-in): the package
// title, revision, decision, dates, the return's sha-256, the fingerprint of the certificate
// that signed it, and whether a later revision
// supersedes it — nothing else. Unknown and malformed codes get the same plain 404.
import { Router } from 'express';
import { z } from 'zod';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { AppContext } from '../../context';
import { AppError } from '../../lib/app-error';
import { byAddress, limiter } from '../auth/rate-limits';
import { LiftPackage, Revision } from '../packages/package.entity';
import { DecisionRecord, StampedReturn } from '../reviews/review.entity';

const Code = z.string().regex(/^[A-Z2-7]{24}$/);

export function verifyRoutes(ctx: AppContext): Router {
  const router = Router();
  const limit = limiter(ctx, {
    name: 'verify',
    windowMs: 60_000,
    limit: ctx.config.VERIFY_LIMIT_PER_MINUTE,
    key: byAddress,
    code: 'too_many_requests',
    message: 'Too many look-ups. Wait a minute and try again.',
  });

  router.get('/verify/:code', limit, async (req, res) => {
    const notFound = new AppError(
      404,
      'not_found',
      'No stamped return has this code. Check the code on the stamp.',
    );
    const code = Code.safeParse(String(req.params.code).toUpperCase());
    if (!code.success) throw notFound;
    const ds = ctx.dataSource;
    const ret = await ds
      .getRepository(StampedReturn)
      .findOneBy({ verificationCode: code.data, state: 'ready' });
    if (!ret) throw notFound;
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
    res.setHeader('Cache-Control', 'no-store');
    res.json({
      found: true,
      reference: pkg.reference,
      title: pkg.title,
      revision: revision.number,
      decision: decision.decision,
      decisionLabel: DECISION_LABELS[decision.decision],
      decidedOn: decision.createdAt.toISOString(),
      issuedOn: (ret.readyAt ?? ret.createdAt).toISOString(),
      sha256: ret.sha256!,
      signingCertificateSha256: ret.signingCertificateSha256,
      current: !later && newerReturn === 0,
      supersededBy: later?.number ?? null,
    });
  });
  return router;
}

// The public verification answer for a stamped return's code (no sign-in): the package
// title, revision, decision, dates, the return's sha-256, the fingerprint of the certificate
// that signed it, and whether a later revision
// supersedes it — nothing else. Unknown and malformed codes get the same plain 404.
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context';
import { AppError } from '../../lib/app-error';
import { byAddress, limiter } from '../auth/rate-limits';
import { verifyReturn } from './service';

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
    const answer = await verifyReturn(ctx.dataSource, code.data);
    if (!answer) throw notFound;
    res.setHeader('Cache-Control', 'no-store');
    res.json(answer);
  });
  return router;
}

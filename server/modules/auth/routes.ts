// Sign-in, sign-out and the signed-in person (GET /api/me).
import { Router } from 'express';
import { SignInBody } from '@shared/schemas/auth';
import type { AppContext } from '../../context';
import { currentUser, optionalSession, requireAuth } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { SESSION_COOKIE } from './passport';
import { signInLimits } from './rate-limits';
import { signIn } from './service';
import { startSession } from './session-cookie';
import { revokeSession } from './sessions';

export function authRoutes(ctx: AppContext): Router {
  const router = Router();
  const { config } = ctx;
  const secure = (config.APP_URL ?? '').startsWith('https://');

  const signInLimit = signInLimits(ctx);

  router.post('/auth/sign-in', ...signInLimit, validate({ body: SignInBody }), async (req, res) => {
    const body = valid(req, 'body', SignInBody);
    const { user, tokenVersion } = await signIn(ctx.dataSource, body.email, body.password);
    await startSession(ctx, res, user.id, tokenVersion);
    req.log?.info({ userId: user.id }, 'signed in');
    res.json({ user });
  });

  // Sign-out revokes the server-side session, so the old token is refused from now on even
  // when a copy of it survives the cleared cookie.
  router.post('/auth/sign-out', optionalSession(ctx), async (req, res) => {
    if (req.sessionId) await revokeSession(ctx.dataSource, req.sessionId);
    res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax', secure, path: '/' });
    res.status(204).end();
  });

  router.get('/me', requireAuth(ctx.passport), (req, res) => {
    res.json({ user: currentUser(req) });
  });

  return router;
}

// Each person's profile (unit system, reminders, name, password) and the public
// acceptance of an invitation, which sets the password and signs the person in.
import { Router, type Response } from 'express';
import { z } from 'zod';
import { AcceptInviteBody, PasswordChangeBody, ProfilePatch } from '@shared/schemas/admin';
import type { AppContext } from '../../context';
import { currentActor, requireAuth } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { acceptInvite } from '../admin/people';
import { toAuthUser } from '../auth/passport';
import { hashPassword } from '../auth/service';
import { byAddress, limiter } from '../auth/rate-limits';
import { startSession } from '../auth/session-cookie';
import { changePassword, getProfile, inviteInfo, updateProfile } from './service';

export const TokenParams = z.object({ token: z.string().min(10).max(100) });

export function profileRoutes(ctx: AppContext): Router {
  const router = Router();
  const ds = ctx.dataSource;
  const setSession = (res: Response, userId: string, tokenVersion: number) =>
    startSession(ctx, res, userId, tokenVersion);
  router.get('/me/profile', requireAuth(ctx.passport), async (req, res) => {
    res.json(await getProfile(ds, currentActor(req)));
  });

  router.patch(
    '/me/profile',
    requireAuth(ctx.passport),
    validate({ body: ProfilePatch }),
    async (req, res) => {
      res.json(await updateProfile(ds, currentActor(req), valid(req, 'body', ProfilePatch)));
    },
  );

  const passwordLimit = limiter(ctx, {
    name: 'password-change',
    windowMs: ctx.config.SIGN_IN_WINDOW_MINUTES * 60_000,
    limit: ctx.config.PASSWORD_CHANGE_LIMIT,
    key: (req, res) => req.user?.id ?? byAddress(req, res),
    message: 'Too many password changes in a short time. Wait a few minutes and try again.',
  });
  const inviteLimit = limiter(ctx, {
    name: 'invite-lookup',
    windowMs: ctx.config.SIGN_IN_WINDOW_MINUTES * 60_000,
    limit: ctx.config.INVITE_LOOKUP_LIMIT,
    key: byAddress,
    code: 'too_many_requests',
    message: 'Too many invitation look-ups from this address. Wait a few minutes and try again.',
  });

  router.post(
    '/me/password',
    requireAuth(ctx.passport),
    passwordLimit,
    validate({ body: PasswordChangeBody }),
    async (req, res) => {
      const session = await changePassword(ds, currentActor(req), valid(req, 'body', PasswordChangeBody));
      // A new password ends every other session; this one gets a fresh token.
      await setSession(res, session.userId, session.tokenVersion);
      res.status(204).end();
    },
  );

  router.get('/invites/:token', inviteLimit, validate({ params: TokenParams }), async (req, res) => {
    res.json(await inviteInfo(ds, valid(req, 'params', TokenParams).token));
  });

  router.post(
    '/invites/:token',
    inviteLimit,
    validate({ params: TokenParams, body: AcceptInviteBody }),
    async (req, res) => {
      const { token } = valid(req, 'params', TokenParams);
      const user = await acceptInvite(
        ds,
        token,
        await hashPassword(valid(req, 'body', AcceptInviteBody).password),
      );
      await setSession(res, user.id, user.tokenVersion);
      res.json({ user: toAuthUser(user) });
    },
  );

  return router;
}

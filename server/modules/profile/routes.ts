// Each person's profile (unit system, reminders, name, password) and the public
// acceptance of an invitation, which sets the password and signs the person in.
import bcrypt from 'bcryptjs';
import { Router, type Response } from 'express';
import { z } from 'zod';
import { AcceptInviteBody, PasswordChangeBody, ProfilePatch } from '@shared/schemas/admin';
import type { AppContext } from '../../context';
import { AppError } from '../../lib/app-error';
import { currentUser, requireAuth } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { acceptInvite, findInvite } from '../admin/service';
import { toAuthUser } from '../auth/passport';
import { hashPassword } from '../auth/service';
import { byAddress, limiter } from '../auth/rate-limits';
import { startSession } from '../auth/session-cookie';
import { User } from '../users/user.entity';

export const TokenParams = z.object({ token: z.string().min(10).max(100) });

export function profileRoutes(ctx: AppContext): Router {
  const router = Router();
  const ds = ctx.dataSource;
  const setSession = (res: Response, userId: string, tokenVersion: number) =>
    startSession(ctx, res, userId, tokenVersion);
  const profileOf = (u: User) => ({
    name: u.name,
    email: u.email,
    unitSystem: u.unitSystem,
    notifyReminders: u.notifyReminders,
  });

  router.get('/me/profile', requireAuth(ctx.passport), async (req, res) => {
    res.json(profileOf(await ds.getRepository(User).findOneByOrFail({ id: currentUser(req).id })));
  });

  router.patch(
    '/me/profile',
    requireAuth(ctx.passport),
    validate({ body: ProfilePatch }),
    async (req, res) => {
      const body = valid(req, 'body', ProfilePatch);
      const id = currentUser(req).id;
      if (Object.keys(body).length) await ds.getRepository(User).update(id, body);
      res.json(profileOf(await ds.getRepository(User).findOneByOrFail({ id })));
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
      const body = valid(req, 'body', PasswordChangeBody);
      const user = await ds.getRepository(User).findOneByOrFail({ id: currentUser(req).id });
      if (!user.passwordHash || !(await bcrypt.compare(body.currentPassword, user.passwordHash))) {
        throw new AppError(400, 'wrong_password', 'The current password is not right.', [
          { path: 'currentPassword', message: 'currentPassword is not right' },
        ]);
      }
      // A new password ends every other session; this one gets a fresh token.
      await ds.getRepository(User).update(user.id, {
        passwordHash: await hashPassword(body.newPassword),
        tokenVersion: user.tokenVersion + 1,
      });
      await setSession(res, user.id, user.tokenVersion + 1);
      res.status(204).end();
    },
  );

  router.get('/invites/:token', inviteLimit, validate({ params: TokenParams }), async (req, res) => {
    const user = await findInvite(ds, valid(req, 'params', TokenParams).token);
    res.json({
      email: user.email,
      name: user.name,
      organisation: user.organisation!.name,
      expiresAt: user.inviteExpiresAt!.toISOString(),
    });
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

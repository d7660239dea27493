// Each person's own profile: read and change it, change the password (which ends every
// other session), and the public look-up of an invitation by its token.
import bcrypt from 'bcryptjs';
import type { DataSource } from 'typeorm';
import type { Actor } from '@shared/rules/actor';
import type { z } from 'zod';
import type { PasswordChangeBody, ProfilePatch } from '@shared/schemas/admin';
import { AppError } from '../../lib/app-error';
import { findInvite } from '../admin/people';
import { hashPassword } from '../auth/service';
import { User } from '../users/user.entity';

function profileOf(u: User) {
  return { name: u.name, email: u.email, unitSystem: u.unitSystem, notifyReminders: u.notifyReminders };
}

export async function getProfile(ds: DataSource, actor: Actor) {
  return profileOf(await ds.getRepository(User).findOneByOrFail({ id: actor.id }));
}

export async function updateProfile(ds: DataSource, actor: Actor, body: z.infer<typeof ProfilePatch>) {
  if (Object.keys(body).length) await ds.getRepository(User).update(actor.id, body);
  return getProfile(ds, actor);
}

/** Checks the current password, stores the new one; returns the token version the new session carries. */
export async function changePassword(ds: DataSource, actor: Actor, body: z.infer<typeof PasswordChangeBody>) {
  const user = await ds.getRepository(User).findOneByOrFail({ id: actor.id });
  if (!user.passwordHash || !(await bcrypt.compare(body.currentPassword, user.passwordHash))) {
    throw new AppError(400, 'wrong_password', 'The current password is not right.', [
      { path: 'currentPassword', message: 'currentPassword is not right' },
    ]);
  }
  const tokenVersion = user.tokenVersion + 1;
  await ds.getRepository(User).update(user.id, {
    passwordHash: await hashPassword(body.newPassword),
    tokenVersion,
  });
  return { userId: user.id, tokenVersion };
}

export async function inviteInfo(ds: DataSource, token: string) {
  const user = await findInvite(ds, token);
  return {
    email: user.email,
    name: user.name,
    organisation: user.organisation!.name,
    expiresAt: user.inviteExpiresAt!.toISOString(),
  };
}

// Sign-in: one generic answer for an unknown e-mail, a wrong password or a deactivated
// account, and the same bcrypt work in each case so timing does not tell them apart.
import bcrypt from 'bcryptjs';
import jwt from 'jsonwebtoken';
import type { DataSource } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { User } from '../users/user.entity';
import { toAuthUser, type TokenPayload } from './passport';

const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', 10);
export const INVALID_CREDENTIALS = 'Email or password is incorrect.';

export async function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, 10);
}

export async function signIn(dataSource: DataSource, email: string, password: string) {
  const user = await dataSource
    .getRepository(User)
    .createQueryBuilder('u')
    .leftJoinAndSelect('u.organisation', 'o')
    .where('lower(u.email) = lower(:email)', { email })
    .getOne();
  const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
  if (!user || !user.passwordHash || !ok || !user.active) {
    throw new AppError(401, 'invalid_credentials', INVALID_CREDENTIALS);
  }
  return { user: toAuthUser(user), tokenVersion: user.tokenVersion };
}

export function issueToken(
  userId: string,
  tokenVersion: number,
  sessionId: string,
  secret: string,
  hours: number,
): string {
  const payload: TokenPayload = { sub: userId, tv: tokenVersion, sid: sessionId };
  return jwt.sign(payload, secret, { algorithm: 'HS256', expiresIn: Math.round(hours * 3600) });
}

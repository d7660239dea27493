// Starts a session: a server-side row and the httpOnly cookie carrying its token.
import type { Response } from 'express';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import { SESSION_COOKIE } from './passport';
import { issueToken } from './service';
import { openSession } from './sessions';

/** Opens a session and sets the httpOnly session cookie carrying its token. */
export async function startSession(
  ctx: { dataSource: DataSource; config: Config },
  res: Response,
  userId: string,
  tokenVersion: number,
): Promise<void> {
  const { config } = ctx;
  const sid = await openSession(ctx.dataSource, userId, config.SESSION_HOURS);
  res.cookie(SESSION_COOKIE, issueToken(userId, tokenVersion, sid, config.JWT_SECRET, config.SESSION_HOURS), {
    httpOnly: true,
    sameSite: 'lax',
    secure: (config.APP_URL ?? '').startsWith('https://'),
    path: '/',
    maxAge: config.SESSION_HOURS * 3600_000,
  });
}

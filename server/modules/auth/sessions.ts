// Server-side sessions: each sign-in writes a row, the token carries its id (`sid`), and
// passport refuses a token whose row is revoked, expired or missing. Sign-out revokes.
import type { DataSource } from 'typeorm';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && UUID.test(value);
}

export async function openSession(dataSource: DataSource, userId: string, hours: number): Promise<string> {
  const rows: { id: string }[] = await dataSource.query(
    `INSERT INTO sessions (user_id, expires_at) VALUES ($1, now() + make_interval(secs => $2)) RETURNING id`,
    [userId, Math.round(hours * 3600)],
  );
  return rows[0].id;
}

/** A live session, $3 its id and $1 its user's: the passport strategy asks it with the user, per request. */
export const LIVE_SESSION = `SELECT 1 FROM sessions WHERE id = $3 AND user_id = $1 AND revoked_at IS NULL AND expires_at > now()`;

export async function revokeSession(dataSource: DataSource, sessionId: string): Promise<void> {
  await dataSource.query(`UPDATE sessions SET revoked_at = now() WHERE id = $1 AND revoked_at IS NULL`, [
    sessionId,
  ]);
}

// The signed-in person's hand-offs: the mail the desk wrote them (not invitations, which go to
// people who are not yet on the desk), newest first, with what they have marked read.
import type { DataSource } from 'typeorm';
import type { Actor } from '@shared/rules/actor';
import type { HandOffList, MarkHandOffsRead } from '@shared/schemas/hand-offs';
import { handOffKind } from '@shared/vocabulary/hand-offs';

const LIST_LIMIT = 50;
const UNREAD_CAP = 100;

export async function unreadHandOffs(ds: DataSource, user: Actor): Promise<number> {
  const [row] = await ds.query(
    `SELECT count(*)::int AS n FROM (
       SELECT 1 FROM mail_messages
        WHERE recipient_id = $1 AND read_at IS NULL AND event <> 'invite' LIMIT ${UNREAD_CAP}) u`,
    [user.id],
  );
  return (row as { n: number }).n;
}

export async function listHandOffs(ds: DataSource, user: Actor): Promise<HandOffList> {
  const rows: Array<{
    id: string;
    event: string;
    subject: string;
    package_id: string | null;
    created_at: Date;
    read_at: Date | null;
  }> = await ds.query(
    `SELECT id, event, subject, package_id, created_at, read_at FROM mail_messages
      WHERE recipient_id = $1 AND event <> 'invite'
      ORDER BY created_at DESC, id DESC LIMIT ${LIST_LIMIT}`,
    [user.id],
  );
  return {
    unread: await unreadHandOffs(ds, user),
    items: rows.map((r) => ({
      id: r.id,
      text: r.subject,
      kind: handOffKind(r.event),
      packageId: r.package_id,
      at: r.created_at.toISOString(),
      read: r.read_at !== null,
    })),
  };
}

/** Marks the person's own hand-offs read (ids of anyone else's are passed over). */
export async function markHandOffsRead(ds: DataSource, user: Actor, body: MarkHandOffsRead) {
  if (body.all)
    await ds.query(`UPDATE mail_messages SET read_at = now() WHERE recipient_id = $1 AND read_at IS NULL`, [
      user.id,
    ]);
  else
    await ds.query(
      `UPDATE mail_messages SET read_at = now() WHERE recipient_id = $1 AND read_at IS NULL AND id = ANY($2::uuid[])`,
      [user.id, body.ids ?? []],
    );
  return { unread: await unreadHandOffs(ds, user) };
}

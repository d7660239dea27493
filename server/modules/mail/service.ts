// Mail goes through the queue, so a slow or failing mail server never slows a request
// or loses a message: a row per recipient and its job intent are written in the same
// transaction as the change it reports (deduplicated by key), then a job per row sends it
// with retries (queued after the commit, or by the worker's relay when Redis was away).
import type { EntityManager } from 'typeorm';
import { In } from 'typeorm';
import type { Queues } from '../../lib/queues';
import { handOff, mailIntent, recordIntent } from '../jobs/intents';
import { User } from '../users/user.entity';
import type { MailEvent } from './mail.entity';
import type { Rendered } from './templates';

export interface MailDraft {
  event: MailEvent;
  dedupeKey: string;
  packageId: string | null;
  recipient: Pick<User, 'id' | 'email'>;
  content: Rendered;
  /** An invitation's link, sealed: the content holds LINK_PLACEHOLDER where it goes. */
  sealedLink?: string;
}

/** Writes the messages (skipping ones already written) and returns the ids to send. */
export async function stageMail(m: EntityManager, drafts: MailDraft[]): Promise<string[]> {
  const ids: string[] = [];
  for (const d of drafts) {
    const rows: Array<{ id: string }> = await m.query(
      `INSERT INTO mail_messages (event, dedupe_key, package_id, recipient_id, to_address, subject, text_body, html_body, sealed_link)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9) ON CONFLICT (dedupe_key) DO NOTHING RETURNING id`,
      [
        d.event,
        d.dedupeKey,
        d.packageId,
        d.recipient.id,
        d.recipient.email,
        d.content.subject.slice(0, 300),
        d.content.text,
        d.content.html,
        d.sealedLink ?? null,
      ],
    );
    if (rows[0]) {
      ids.push(rows[0].id);
      await recordIntent(m, mailIntent(rows[0].id));
    }
  }
  return ids;
}

/** After the commit: queues a send job per message (bounded; the relay queues any it missed). */
export async function dispatchMail(queues: Queues, ids: string[]) {
  await handOff(queues, ids.map(mailIntent));
}

/** Active people of a site who review it. */
export async function siteReviewers(m: EntityManager, siteId: string): Promise<User[]> {
  const rows: Array<{ user_id: string }> = await m.query(
    `SELECT user_id FROM site_members WHERE site_id = $1`,
    [siteId],
  );
  if (!rows.length) return [];
  return m
    .getRepository(User)
    .find({ where: { id: In(rows.map((r) => r.user_id)), active: true, role: 'reviewer' } });
}

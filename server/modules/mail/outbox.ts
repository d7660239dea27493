// The desk's outbox for its admin: what the desk sent, queued or failed (with the error), what
// the local fake SMTP server received (embedded set-up), and sending a failed message again.
// Mail of the admin's own desk only: a person of the desk, or of a contractor the desk added.
import type { DataSource } from 'typeorm';
import type { Actor } from '@shared/rules/actor';
import { AppError } from '../../lib/app-error';
import type { Queues } from '../../lib/queues';
import { handOff, mailIntent, nextRound, recordIntent } from '../jobs/intents';
import { MailMessage } from './mail.entity';

const OF_THE_DESK = '(u.organisation_id = :org OR o.desk_owner_id = :org)';

function deskMail(ds: DataSource, admin: Actor) {
  return ds
    .getRepository(MailMessage)
    .createQueryBuilder('mm')
    .leftJoin('users', 'u', 'u.id = mm.recipient_id')
    .leftJoin('organisations', 'o', 'o.id = u.organisation_id')
    .where(OF_THE_DESK, { org: admin.organisationId });
}

export async function listOutbox(
  ds: DataSource,
  admin: Actor,
  q: { status?: 'queued' | 'sent' | 'failed'; page: number; pageSize: number },
) {
  const qb = deskMail(ds, admin)
    .orderBy('mm.created_at', 'DESC')
    .skip((q.page - 1) * q.pageSize)
    .take(q.pageSize);
  if (q.status) qb.andWhere('mm.status = :status', { status: q.status });
  const [rows, total] = await qb.getManyAndCount();
  return {
    total,
    items: rows.map((m) => ({
      id: m.id,
      event: m.event,
      to: m.toAddress,
      subject: m.subject,
      status: m.status,
      attempts: m.attempts,
      lastError: m.lastError,
      packageId: m.packageId,
      createdAt: m.createdAt.toISOString(),
      sentAt: m.sentAt?.toISOString() ?? null,
    })),
  };
}

/**
 * An invitation link works once, for the person invited: the admin reading caught mail sees
 * that a link was sent, not the link itself.
 */
export function hideInviteLinks(text: string): string {
  return text.replace(/\/invite\/[A-Za-z0-9_-]+/g, '/invite/[link sent to the recipient]');
}

export async function listCaught(ds: DataSource, admin: Actor) {
  const rows: Array<{
    id: string;
    envelope_from: string;
    envelope_to: string[];
    subject: string;
    text_body: string;
    html_body: string | null;
    received_at: Date;
  }> = await ds.query(
    `SELECT c.* FROM caught_mail c
       WHERE EXISTS (SELECT 1 FROM users u JOIN organisations o ON o.id = u.organisation_id
                     WHERE lower(u.email) = ANY (SELECT lower(x) FROM unnest(c.envelope_to) x)
                       AND (u.organisation_id = $1 OR o.desk_owner_id = $1))
       ORDER BY c.received_at DESC LIMIT 200`,
    [admin.organisationId],
  );
  return {
    items: rows.map((r) => ({
      id: r.id,
      from: r.envelope_from,
      to: r.envelope_to,
      subject: r.subject,
      text: hideInviteLinks(r.text_body),
      html: r.html_body === null ? null : hideInviteLinks(r.html_body),
      receivedAt: new Date(r.received_at).toISOString(),
    })),
  };
}

/** A message that finally failed, queued again; another desk's message is a plain 404. */
export async function retryMail(ds: DataSource, queues: Queues, admin: Actor, id: string) {
  const msg = await deskMail(ds, admin)
    .andWhere('mm.id = :id AND mm.status = :status', { id, status: 'failed' })
    .getOne();
  if (!msg) throw AppError.notFound('failed message');
  // Through the job hand-off: the intent is written with the status, a new round gets a job id
  // of its own (the failed job keeps the old one), and a dead Redis leaves it to the relay.
  const intent = await ds.transaction(async (m) => {
    await m.getRepository(MailMessage).update(id, { status: 'queued' });
    const next = mailIntent(id, await nextRound(m, 'mail', id));
    await recordIntent(m, next);
    return next;
  });
  await handOff(queues, [intent]);
  return { id, status: 'queued' as const };
}

// Sending one staged message. A sent message is never sent again; a failure is recorded
// with its error and retried by the queue; the last failed attempt marks it failed, where
// admins see it on the outbox page. An invitation's link is opened from its sealed value
// here, put into the message only as it goes out, and the sealed value cleared once sent.
import type { DataSource } from 'typeorm';
import { sendMail } from '../../lib/mailer';
import { MailMessage } from './mail.entity';
import { LINK_PLACEHOLDER, unsealLink } from './sealed-link';
import { escape } from './templates';

export interface SenderOptions {
  smtpUrl: string;
  from: string;
  /** The key invitation links are sealed with (JWT_SECRET). */
  secret: string;
}

export async function sendStaged(
  ds: DataSource,
  opts: SenderOptions,
  messageId: string,
  attempt: { number: number; last: boolean },
): Promise<'sent' | 'already_sent' | 'missing' | 'link_expired'> {
  const message = await ds.getRepository(MailMessage).findOneBy({ id: messageId });
  if (!message) return 'missing';
  if (message.status === 'sent') return 'already_sent';
  let text = message.textBody;
  let html = message.htmlBody;
  if (message.sealedLink !== null) {
    const link = unsealLink(opts.secret, message.sealedLink);
    if (!link) {
      // Never send a message with the placeholder in it: the link ran out before it went.
      await ds.getRepository(MailMessage).update(message.id, {
        attempts: attempt.number,
        status: 'failed',
        sealedLink: null,
        lastError: 'The invitation link expired before the message was sent; send a new link.',
      });
      return 'link_expired';
    }
    text = text.split(LINK_PLACEHOLDER).join(link);
    html = html.split(LINK_PLACEHOLDER).join(escape(link));
  }
  try {
    await sendMail(opts.smtpUrl, {
      id: message.id,
      from: opts.from,
      to: message.toAddress,
      subject: message.subject,
      text,
      html,
    });
  } catch (error) {
    await ds.getRepository(MailMessage).update(message.id, {
      attempts: attempt.number,
      lastError: (error as Error).message.slice(0, 1000),
      status: attempt.last ? 'failed' : 'queued',
    });
    throw error;
  }
  await ds
    .getRepository(MailMessage)
    .update(message.id, { status: 'sent', sentAt: new Date(), attempts: attempt.number, sealedLink: null });
  return 'sent';
}

// Sending one staged message. A sent message is never sent again; a failure is recorded
// with its error and retried by the queue; the last failed attempt marks it failed, where
// admins see it on the outbox page.
import type { DataSource } from 'typeorm';
import { sendMail } from '../../lib/mailer';
import { MailMessage } from './mail.entity';

export async function sendStaged(
  ds: DataSource,
  smtpUrl: string,
  from: string,
  messageId: string,
  attempt: { number: number; last: boolean },
): Promise<'sent' | 'already_sent' | 'missing'> {
  const message = await ds.getRepository(MailMessage).findOneBy({ id: messageId });
  if (!message) return 'missing';
  if (message.status === 'sent') return 'already_sent';
  try {
    await sendMail(smtpUrl, {
      id: message.id,
      from,
      to: message.toAddress,
      subject: message.subject,
      text: message.textBody,
      html: message.htmlBody,
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
    .update(message.id, { status: 'sent', sentAt: new Date(), attempts: attempt.number });
  return 'sent';
}

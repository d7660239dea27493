// Sends one message over SMTP with nodemailer. SMTP_URL names the server (a provider in
// production, the local fake SMTP server in the embedded set-up).
import nodemailer, { type Transporter } from 'nodemailer';
import type SMTPTransport from 'nodemailer/lib/smtp-transport';

let cached: { url: string; transport: Transporter } | null = null;

export function mailTransport(url: string): Transporter {
  if (cached?.url === url) return cached.transport;
  const options: SMTPTransport.Options = {
    url,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  };
  const transport = nodemailer.createTransport(options);
  cached = { url, transport };
  return transport;
}

export interface OutgoingMail {
  id: string;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
}

export async function sendMail(url: string, mail: OutgoingMail) {
  await mailTransport(url).sendMail({
    from: mail.from,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    // A stable Message-ID lets a receiving server drop a duplicate of a retried send.
    messageId: `<${mail.id}@counterpoise.mail>`,
  });
}

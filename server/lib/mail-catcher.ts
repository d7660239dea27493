// The local fake SMTP server of the embedded set-up: it accepts messages over a real SMTP
// conversation on loopback and keeps them in the database, where admins read them on the
// outbox page. A message seen twice (same Message-ID) is kept once.
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { DataSource } from 'typeorm';

export interface CatcherOptions {
  port: number;
  host?: string;
  /** For tests: answer the first N messages with a temporary failure (451). */
  failFirst?: number;
}

export async function startMailCatcher(ds: DataSource, opts: CatcherOptions) {
  let toFail = opts.failFirst ?? 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    banner: 'Counterpoise local outbox',
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        if (toFail > 0) {
          toFail -= 1;
          const err = Object.assign(new Error('Try again later (test failure)'), { responseCode: 451 });
          return callback(err);
        }
        const raw = Buffer.concat(chunks);
        simpleParser(raw)
          .then((parsed) =>
            ds.query(
              `INSERT INTO caught_mail (message_id, envelope_from, envelope_to, subject, text_body, html_body, raw_size)
               SELECT $1, $2, $3, $4, $5, $6, $7
               WHERE $1::varchar IS NULL OR NOT EXISTS (SELECT 1 FROM caught_mail WHERE message_id = $1)`,
              [
                parsed.messageId ?? null,
                session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
                session.envelope.rcptTo.map((r) => r.address),
                parsed.subject ?? '',
                parsed.text ?? '',
                typeof parsed.html === 'string' ? parsed.html : null,
                raw.length,
              ],
            ),
          )
          .then(() => callback())
          .catch((error: Error) => callback(error));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, opts.host ?? '127.0.0.1', () => resolve());
  });
  server.on('error', () => undefined);
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : opts.port;
  return {
    port,
    url: `smtp://127.0.0.1:${port}`,
    close: () => new Promise<void>((r) => server.close(() => r())),
  };
}

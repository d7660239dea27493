// The fake SMTP server as its own process (started by the start command when SMTP_URL is
// not set).
import 'reflect-metadata';
import { databaseSettings, mailCatcherPort } from './config';
import { createDataSource } from './db/data-source';
import { startMailCatcher } from './lib/mail-catcher';
import { logger } from './lib/logger';

async function main() {
  const ds = createDataSource(databaseSettings().url);
  await ds.initialize();
  const catcher = await startMailCatcher(ds, { port: mailCatcherPort() });
  logger.info({ url: catcher.url }, 'local outbox (fake SMTP) listening');
  const stop = async () => {
    await catcher.close();
    await ds.destroy();
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop());
  process.on('SIGINT', () => void stop());
}

main().catch((error) => {
  process.stderr.write(`[mail-catcher] could not start: ${(error as Error).message}\n`);
  process.exit(1);
});

// The API process: connect, listen, and close everything on SIGTERM/SIGINT.
import { loadConfig } from './config';
import { createApp } from './app';
import { connect, StartupError } from './bootstrap';
import { logger } from './lib/logger';

async function main() {
  let config;
  try {
    config = loadConfig();
  } catch (error) {
    process.stderr.write(`${(error as Error).message}\n`);
    process.exit(2);
  }
  const ctx = await connect(config);
  const app = createApp(ctx);
  const server = app.listen(config.PORT, config.HOST, () => {
    logger.info({ url: `http://${config.HOST}:${config.PORT}` }, 'API listening');
  });
  let closing = false;
  const shutdown = async (signal: string) => {
    if (closing) return;
    closing = true;
    logger.info({ signal }, 'API closing');
    server.close();
    server.closeAllConnections?.();
    await ctx.close?.();
    process.exit(0);
  };
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
  process.on('SIGINT', () => void shutdown('SIGINT'));
}

process.on('unhandledRejection', (reason) => logger.error({ err: reason }, 'unhandled rejection'));

main().catch((error) => {
  if (error instanceof StartupError) {
    process.stderr.write(`[api] ${error.message}\n`);
  } else {
    logger.fatal({ err: error }, 'API could not start');
  }
  process.exit(1);
});

// The API process: connect, listen, and close on SIGTERM/SIGINT (stop taking requests,
// let those under way finish within a time limit, then close the connections).
import { rm } from 'node:fs/promises';
import { loadConfig } from './config';
import { createApp } from './app';
import { connect, handleProcessEvents, StartupError } from './bootstrap';
import { logger } from './lib/logger';
import { uploadWorkDir } from './modules/files/pdf-check';

const CLOSE_LIMIT_MS = 8_000;

let close: (code: number) => Promise<void> = async (code) => process.exit(code);
handleProcessEvents('api', (code) => close(code));

async function main() {
  let config;
  try {
    config = loadConfig();
  } catch (error) {
    process.stderr.write(`${(error as Error).message}\n`);
    process.exit(2);
  }
  const ctx = await connect(config);
  // Working copies of uploads cut short by the last API process's end (one API per data
  // folder: the start command's lock): nothing refers to them.
  await rm(uploadWorkDir(config), { recursive: true, force: true });
  const app = createApp(ctx);
  const server = app.listen(config.PORT, config.HOST, () => {
    logger.info({ url: `http://${config.HOST}:${config.PORT}` }, 'API listening');
  });
  server.on('error', (err: NodeJS.ErrnoException) => {
    logger.fatal(
      { err },
      err.code === 'EADDRINUSE' ? `port ${config.PORT} is taken` : 'API could not listen',
    );
    void close(1);
  });
  let closing = false;
  close = async (code: number) => {
    if (closing) return;
    closing = true;
    logger.info({ code }, 'API closing');
    await Promise.race([
      new Promise<void>((r) => server.close(() => r())),
      new Promise<void>((r) => setTimeout(r, CLOSE_LIMIT_MS).unref()),
    ]);
    server.closeAllConnections?.();
    await ctx.close?.().catch(() => undefined);
    process.exit(code);
  };
  process.on('SIGTERM', () => void close(0));
  process.on('SIGINT', () => void close(0));
}

main().catch((error) => {
  if (error instanceof StartupError) {
    process.stderr.write(`[api] ${error.message}\n`);
  } else {
    logger.fatal({ err: error }, 'API could not start');
  }
  process.exit(1);
});

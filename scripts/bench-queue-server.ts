// The process npm run bench:queue sends its requests to: the desk's API as the start command
// builds it (connect, createApp, one process), or with --bare a bare Express app whose one route
// answers the bytes in BENCH_BARE_BODY (the floor the queue is compared with). It prints
// "listening <port>" when it takes requests and closes on SIGTERM.
import 'reflect-metadata';
import fs from 'node:fs';
import type { Server } from 'node:http';
import express from 'express';

async function start(): Promise<{ server: Server; close: () => Promise<void> }> {
  if (process.argv.includes('--bare')) {
    const body = fs.readFileSync(process.env.BENCH_BARE_BODY!);
    const app = express();
    app.get('/bare', (_req, res) => {
      res.type('application/json').send(body);
    });
    return { server: app.listen(0, '127.0.0.1'), close: async () => undefined };
  }
  const { loadConfig } = await import('../server/config');
  const { connect } = await import('../server/bootstrap');
  const { createApp } = await import('../server/app');
  const ctx = await connect(loadConfig());
  const app = createApp(ctx, { clientDir: '/nonexistent' });
  return { server: app.listen(0, '127.0.0.1'), close: async () => ctx.close?.() };
}

const { server, close } = await start();
server.on('listening', () => {
  const address = server.address();
  process.stdout.write(`listening ${typeof address === 'object' && address ? address.port : 0}\n`);
});
process.on('SIGTERM', () => {
  server.close();
  server.closeAllConnections();
  void close().finally(() => process.exit(0));
});

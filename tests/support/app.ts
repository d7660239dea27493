// Builds the real Express app against the test command's PostgreSQL and Redis, in-process.
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import supertest from 'supertest';
import { createApp } from '@server/app';
import { connect } from '@server/bootstrap';
import { loadConfig, type Config } from '@server/config';
import type { AppContext } from '@server/context';

export interface TestApp {
  ctx: AppContext;
  app: Express;
  close(): Promise<void>;
}

export async function startTestApp(overrides: Partial<Config> = {}): Promise<TestApp> {
  // Each test app gets its own queue prefix, so parallel test files never share jobs.
  const config = { ...loadConfig(), REDIS_PREFIX: `t-${randomUUID().slice(0, 8)}`, ...overrides };
  const ctx = await connect(config);
  const app = createApp(ctx, { clientDir: '/nonexistent' });
  return { ctx, app, close: async () => ctx.close?.() };
}

/** A supertest agent that keeps cookies, signed in as the given person. */
export async function signedIn(app: Express, email: string, password = TEST_PASSWORD) {
  // The desk's pages send the CSRF guard header with every change (src/lib/api-client.ts).
  const agent = supertest.agent(app).set('X-CSRF-Guard', '1');
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200)
    throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

export const TEST_PASSWORD = 'correct horse battery';

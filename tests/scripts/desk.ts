// Runs the real start command as a child process for the launcher tests: its own data
// folder and free ports, none of the caller's DATABASE_URL / REDIS_URL / SMTP_URL / S3_*.
import { spawn, type ChildProcess } from 'node:child_process';
import { freePort } from '../../scripts/lib/services';
export { until } from '../support/until';

export interface Ports {
  http: number;
  pg: number;
  redis: number;
  smtp: number;
  s3: number;
}

export interface Desk {
  child: ChildProcess;
  output: () => string;
  exited: Promise<number | null>;
}

export async function freePorts(): Promise<Ports> {
  return {
    http: await freePort(),
    pg: await freePort(),
    redis: await freePort(),
    smtp: await freePort(),
    s3: await freePort(),
  };
}

export function deskEnv(dataDir: string, ports: Ports, extra: NodeJS.ProcessEnv = {}): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env };
  for (const key of ['DATABASE_URL', 'REDIS_URL', 'JWT_SECRET', 'NODE_ENV', 'SMTP_URL', 'APP_URL'])
    delete env[key];
  for (const key of Object.keys(env)) if (key.startsWith('S3_')) delete env[key];
  return {
    ...env,
    DATA_DIR: dataDir,
    PORT: String(ports.http),
    CP_PG_PORT: String(ports.pg),
    CP_REDIS_PORT: String(ports.redis),
    CP_SMTP_PORT: String(ports.smtp),
    CP_S3_PORT: String(ports.s3),
    SKIP_CLIENT_BUILD: '1',
    LOG_LEVEL: 'warn',
    ...extra,
  };
}

/** Starts the command; resolves once it prints its address, or when ready is false, at once. */
export async function launch(
  env: NodeJS.ProcessEnv,
  opts: { ready?: boolean; command?: string[] } = {},
): Promise<Desk> {
  const [cmd, ...args] = opts.command ?? [process.execPath, '--import', 'tsx', 'scripts/start.ts'];
  // spawns: node, runuser (bad-input.test.ts runs the command as the user nobody)
  const child = spawn(cmd, args, { env, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const desk = { child, output: () => out, exited };
  if (opts.ready === false) return desk;
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`start did not become ready:\n${out}`)), 150_000);
    const poll = setInterval(() => {
      if (out.includes('ready: http://')) {
        clearInterval(poll);
        clearTimeout(timer);
        resolve();
      } else if (child.exitCode !== null) {
        clearInterval(poll);
        clearTimeout(timer);
        reject(new Error(`start exited with ${child.exitCode}:\n${out}`));
      }
    }, 200);
  });
  return desk;
}

export async function stopDesk(desk: Desk): Promise<number | null> {
  desk.child.kill('SIGTERM');
  return desk.exited;
}

/** Signs in through the API; returns the session cookie. */
export async function signIn(port: number, email: string, password: string): Promise<string> {
  const res = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in of ${email}: ${res.status} ${await res.text()}`);
  return res.headers.get('set-cookie')!.split(';')[0];
}

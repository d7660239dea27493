// The session-signing secret of the embedded set-up: made once, kept under the data folder.
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

export function localSecret(dataDir: string): string {
  const file = path.join(dataDir, 'jwt-secret');
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim();
  fs.mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

// The invitation link is the one secret a message carries. The stored outbox row holds the
// message with a placeholder where the link goes; the link itself is sealed (AES-256-GCM, a
// key derived from JWT_SECRET) beside it until the invitation expires, opened only by the
// sender at send time, and the sealed value is cleared once the message is sent. So nobody
// reading stored mail (the outbox, the database) finds a usable link.
import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';

/** Stands where the link goes in a stored message's text and HTML. */
export const LINK_PLACEHOLDER = '{{invitation-link}}';

function key(secret: string): Buffer {
  return Buffer.from(hkdfSync('sha256', secret, 'counterpoise', 'sealed invitation link', 32));
}

export function sealLink(secret: string, url: string, expiresAt: Date): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', key(secret), iv);
  const body = Buffer.concat([
    cipher.update(JSON.stringify({ u: url, e: expiresAt.getTime() }), 'utf8'),
    cipher.final(),
  ]);
  return ['v1', iv, cipher.getAuthTag(), body]
    .map((p) => (typeof p === 'string' ? p : p.toString('base64url')))
    .join('.');
}

/** The link, or null when the value is not ours, was altered, or the invitation has expired. */
export function unsealLink(secret: string, sealed: string, now = Date.now()): string | null {
  const [version, iv, tag, body] = sealed.split('.');
  if (version !== 'v1' || !iv || !tag || !body) return null;
  try {
    const decipher = createDecipheriv('aes-256-gcm', key(secret), Buffer.from(iv, 'base64url'));
    decipher.setAuthTag(Buffer.from(tag, 'base64url'));
    const plain = Buffer.concat([decipher.update(Buffer.from(body, 'base64url')), decipher.final()]);
    const { u, e } = JSON.parse(plain.toString('utf8')) as { u: string; e: number };
    return typeof u === 'string' && e > now ? u : null;
  } catch {
    return null;
  }
}

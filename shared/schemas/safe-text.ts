// Text that can be stored and shown: no NUL characters (PostgreSQL refuses them in text)
// and no lone UTF-16 surrogates (they cannot be encoded as UTF-8). Used by the API's input
// guard for every string of a request, and by schemas that want the check on one field.

import { z } from 'zod';
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/** Why a string cannot be stored, or null when it can. */
export function unsafeTextReason(value: string): string | null {
  if (value.includes('\u0000')) return 'must not contain NUL characters';
  if (LONE_SURROGATE.test(value)) return 'must not contain lone UTF-16 surrogates';
  return null;
}

/**
 * A string schema with the same rule as a zod check, so a form (and any other caller of the
 * shared schemas) gets a message naming the field: "title must not contain NUL characters".
 * Chain trim/min/max after it as with z.string().
 */
export function safeText(field: string) {
  return z.string().superRefine((value, ctx) => {
    const reason = unsafeTextReason(value);
    if (reason) ctx.addIssue({ code: 'custom', message: `${field} ${reason}` });
  });
}

// Reading react-hook-form's error tree: a quantity's error sits on its `.value` or on the
// quantity itself, a list's on the list or on a row — the first message found is shown.
import { get, type FieldErrors, type FieldValues } from 'react-hook-form';

export function firstMessage(node: unknown, depth = 0): string | undefined {
  if (!node || typeof node !== 'object' || depth > 6) return undefined;
  const record = node as Record<string, unknown>;
  if (typeof record.message === 'string' && record.message) return record.message;
  for (const [key, child] of Object.entries(record)) {
    if (key === 'ref' || key === 'type' || key === 'types') continue;
    const found = firstMessage(child, depth + 1);
    if (found) return found;
  }
  return undefined;
}

export function errorAt(errors: FieldErrors<FieldValues>, path: string): string | undefined {
  return firstMessage(get(errors, path));
}

/** Every path under the error tree that carries a message. */
export function errorPaths(node: unknown, prefix = '', out: string[] = [], depth = 0): string[] {
  if (!node || typeof node !== 'object' || depth > 8) return out;
  const record = node as Record<string, unknown>;
  if (typeof record.message === 'string' && record.message) out.push(prefix);
  for (const [key, child] of Object.entries(record)) {
    if (key === 'ref' || key === 'type' || key === 'types' || key === 'message') continue;
    errorPaths(child, prefix ? `${prefix}.${key}` : key, out, depth + 1);
  }
  return out;
}

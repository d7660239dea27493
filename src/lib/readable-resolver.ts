// react-hook-form's zod resolver with every message in a person's words (readableIssue): the
// forms show "Boom length must be greater than 0", never a field path or zod's own wording.
import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldValues, Resolver } from 'react-hook-form';
import { readableIssue } from '@shared/catalogue/readable-issue';

/** Rewrites each `message` in react-hook-form's error tree, in place, by its path. */
export function rewordErrors(node: unknown, prefix = '', depth = 0): void {
  if (!node || typeof node !== 'object' || depth > 10) return;
  const record = node as Record<string, unknown>;
  if (typeof record.message === 'string' && record.message)
    record.message = readableIssue(prefix, record.message);
  for (const [key, child] of Object.entries(record)) {
    if (key === 'ref' || key === 'message' || key === 'type') continue;
    rewordErrors(
      child,
      key === 'root' || key === 'types' ? prefix : prefix ? `${prefix}.${key}` : key,
      depth + 1,
    );
  }
}

export function readable<R extends Resolver<FieldValues, unknown, FieldValues>>(resolver: R): R {
  return (async (values, context, options) => {
    const result = await resolver(values, context, options);
    rewordErrors(result.errors);
    return result;
  }) as R;
}

// The same signature as zodResolver, so a form swaps one import for the other.
export const readableResolver = ((...args: unknown[]) =>
  readable((zodResolver as (...a: unknown[]) => never)(...args))) as unknown as typeof zodResolver;

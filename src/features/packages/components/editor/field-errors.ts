// Reading react-hook-form's error tree: a quantity's error sits on its `.value` or on the
// quantity itself, a list's on the list or on a row — the first message found is shown.
import { createContext, useContext } from 'react';
import { get, type FieldErrors } from 'react-hook-form';
import { useLiftFormContext, type Issues, type LiftFormValues } from '../../hooks/use-lift-form';

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

export function errorAt(errors: FieldErrors<LiftFormValues>, path: string): string | undefined {
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

export const IssuesContext = createContext<Issues>({ byPath: new Map(), showAll: false });

export function issueUnder(byPath: Map<string, string>, path: string): string | undefined {
  const exact = byPath.get(path);
  if (exact) return exact;
  for (const [key, message] of byPath) if (key.startsWith(`${path}.`)) return message;
  return undefined;
}

/** The message to show under a field: react-hook-form's, else the schema's once touched. */
export function useFieldError(path: string): string | undefined {
  const { byPath, showAll } = useContext(IssuesContext);
  const {
    formState: { errors, touchedFields },
  } = useLiftFormContext();
  const own = errorAt(errors, path);
  if (own) return own;
  if (showAll || get(touchedFields, path)) return issueUnder(byPath, path);
  return undefined;
}

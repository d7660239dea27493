// A zod error as the field list the API would have answered, so a form shows both alike.
import type { ZodError } from 'zod';

export function zodFieldErrors(error: ZodError): { path: string; message: string }[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join('.') || '(root)', message: i.message }));
}

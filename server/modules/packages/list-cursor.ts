// Keyset paging of the package list. A page is "the rows after (or before) this one" in the list's
// order — the sort key, then the reference, which is unique — so a deep page costs what the first
// does: a range scan of the sort's index from the cursor, with no offset to count past. The cursor
// is opaque to the client: the sort it belongs to, the row's sort key as PostgreSQL writes it, its
// reference and the direction, in base64url JSON.
import { z } from 'zod';
import { PACKAGE_SORTS, type PackageListQuery } from '@shared/schemas/packages';
import { AppError } from '../../lib/app-error';

type Sort = PackageListQuery['sort'];

export interface SortKey {
  /** The SQL expression the sort's index is on; the reference follows it. */
  expr: string;
  /** The PostgreSQL type the cursor's text is read back as. */
  type: 'date' | 'timestamptz' | 'int' | 'varchar';
}

// A missing planned lift date sorts last in both directions: the index of each direction puts
// it at the far end with coalesce() (1764721000000-queue-at-scale).
const KEYS: Record<string, (desc: boolean) => SortKey> = {
  plannedLiftDate: (desc) => ({
    expr: `coalesce(p.planned_lift_date, '${desc ? '-infinity' : 'infinity'}'::date)`,
    type: 'date',
  }),
  // The same for a review due date (1764724300000-review-due).
  reviewDue: (desc) => ({
    expr: `coalesce(p.review_due_on, '${desc ? '-infinity' : 'infinity'}'::date)`,
    type: 'date',
  }),
  updatedAt: () => ({ expr: 'p.updated_at', type: 'timestamptz' }),
  reference: () => ({ expr: 'p.reference', type: 'varchar' }),
  openDiscrepancies: () => ({ expr: 'p.open_discrepancies', type: 'int' }),
  revision: () => ({ expr: 'p.current_revision', type: 'int' }),
};

export function sortKey(sort: Sort): SortKey & { desc: boolean } {
  const desc = sort.startsWith('-');
  return { ...KEYS[sort.replace(/^-/, '')](desc), desc };
}

export interface Cursor {
  sort: Sort;
  key: string;
  reference: string;
  /** after: the page that follows the row; before: the page that ends just before it. */
  direction: 'after' | 'before';
}

const Stored = z.tuple([z.enum(PACKAGE_SORTS), z.string().max(100), z.string().max(30), z.enum(['a', 'b'])]);

export function encodeCursor(c: Cursor): string {
  return Buffer.from(JSON.stringify([c.sort, c.key, c.reference, c.direction[0]])).toString('base64url');
}

export function decodeCursor(text: string, sort: Sort): Cursor {
  let parsed: z.infer<typeof Stored> | undefined;
  try {
    parsed = Stored.parse(JSON.parse(Buffer.from(text, 'base64url').toString('utf8')));
  } catch {
    parsed = undefined;
  }
  if (!parsed)
    throw AppError.badRequest('This page link is not one the list gave out. Start from the first page.', [
      { path: 'query.cursor', message: 'cursor must be one the list gave out' },
    ]);
  if (parsed[0] !== sort)
    throw AppError.badRequest('This page link belongs to another sort. Start from the first page.', [
      { path: 'query.cursor', message: `cursor belongs to the sort ${parsed[0]}, not ${sort}` },
    ]);
  return { sort, key: parsed[1], reference: parsed[2], direction: parsed[3] === 'a' ? 'after' : 'before' };
}

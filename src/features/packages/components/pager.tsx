// Server-side paging: which rows are shown, previous/next, and the page size. Previous and next
// follow the cursors the server gave with the page (keyset paging: a deep page costs what the
// first does); the page number is only shown. The first page is asked for without a cursor.
import { Button } from '@/components/ui/button';
import { PAGE_SIZES } from '../hooks/use-package-list-params';

export function Pager({
  page,
  pageSize,
  total,
  totalOverLimit,
  nextCursor,
  previousCursor,
  shown,
  onPage,
  onPageSize,
}: {
  page: number;
  pageSize: number;
  total: number;
  /** `total` is a lower bound ("at least"). */
  totalOverLimit: boolean;
  nextCursor: string | null;
  previousCursor: string | null;
  /** How many rows this page holds. */
  shown: number;
  onPage: (page: number, cursor: string | undefined) => void;
  onPageSize: (pageSize: number) => void;
}) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = shown === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = (page - 1) * pageSize + shown;
  return (
    <nav aria-label="Pages" className="mt-2 flex flex-wrap items-center justify-between gap-3 text-[13px]">
      <p className="tabular text-ink-soft" aria-live="polite">
        Rows{' '}
        <strong className="text-ink">
          {first}–{last}
        </strong>{' '}
        of{' '}
        <strong className="text-ink">
          {totalOverLimit ? `at least ${total.toLocaleString('en-GB')}` : total}
        </strong>{' '}
        · page {page}
        {totalOverLimit ? '' : ` of ${pages}`}
      </p>
      <div className="flex items-center gap-2">
        <label className="flex items-center gap-1.5 text-ink-soft">
          Rows per page
          <select
            value={pageSize}
            onChange={(event) => onPageSize(Number(event.target.value))}
            className="h-7 rounded-[3px] border border-rule-strong bg-sheet px-1.5 text-ink"
          >
            {PAGE_SIZES.map((size) => (
              <option key={size} value={size}>
                {size}
              </option>
            ))}
          </select>
        </label>
        <Button
          size="sm"
          disabled={page <= 1 && !previousCursor}
          onClick={() =>
            onPage(Math.max(1, page - 1), page - 1 <= 1 ? undefined : (previousCursor ?? undefined))
          }
        >
          ‹ Previous
        </Button>
        <Button size="sm" disabled={!nextCursor} onClick={() => onPage(page + 1, nextCursor ?? undefined)}>
          Next ›
        </Button>
      </div>
    </nav>
  );
}

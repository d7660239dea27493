// Server-side paging: which rows are shown, previous/next, and the page size.
import { Button } from '@/components/ui/button';
import { PAGE_SIZES } from '../hooks/use-package-list-params';

export function Pager({
  page,
  pageSize,
  total,
  onPage,
  onPageSize,
}: {
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
  onPageSize: (pageSize: number) => void;
}) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages" className="mt-2 flex flex-wrap items-center justify-between gap-3 text-[13px]">
      <p className="tabular text-ink-soft" aria-live="polite">
        Rows{' '}
        <strong className="text-ink">
          {first}–{last}
        </strong>{' '}
        of <strong className="text-ink">{total}</strong> · page {page} of {pages}
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
        <Button size="sm" disabled={page <= 1} onClick={() => onPage(page - 1)}>
          ‹ Previous
        </Button>
        <Button size="sm" disabled={page >= pages} onClick={() => onPage(page + 1)}>
          Next ›
        </Button>
      </div>
    </nav>
  );
}

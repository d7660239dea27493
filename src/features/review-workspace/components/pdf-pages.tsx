// The pages of one PDF in a scrolling column with their markup layers, and the page
// thumbnails beside it. Only the pages near the one in view are drawn, so long drawings
// sets stay quick; the page in view is reported to the workspace for paging and linking.
import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import type { Markup } from '@shared/schemas/reviews';
import { markupAnchor } from '../lib/geometry';
import type { PdfDocument, PdfPage, PdfViewport } from '../lib/pdf-loader';
import { PdfCanvas } from './pdf-canvas';

export type Jump = { page: number; markupId?: string | null; nonce: number };
export type Zoom = 'fit' | number;

const PAGE_GAP = 16;
/** The column's side padding plus room for a vertical scroll bar, so Fit width never scrolls sideways. */
const FIT_ALLOWANCE = 2 * 24 + 18;
const THUMB_WIDTH = 92;
const DRAW_AROUND = 2;

function usePages(doc: PdfDocument): (PdfPage | null)[] {
  const [pages, setPages] = useState<{ doc: PdfDocument; list: (PdfPage | null)[] }>({ doc, list: [] });
  useEffect(() => {
    let live = true;
    const list: (PdfPage | null)[] = Array.from({ length: doc.numPages }, () => null);
    (async () => {
      for (let n = 1; n <= doc.numPages && live; n++) {
        list[n - 1] = await doc.getPage(n);
        // Publish the first page at once (it sets the sizes), then every few pages.
        if (live && (n === 1 || n % 4 === 0 || n === doc.numPages)) setPages({ doc, list: [...list] });
      }
    })().catch(() => {
      // A page that cannot be read stays a blank placeholder; the others still show.
    });
    return () => {
      live = false;
    };
  }, [doc]);
  return pages.doc === doc ? pages.list : [];
}

function useWidth(ref: React.RefObject<HTMLElement | null>): number {
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(([entry]) => setWidth(entry.contentRect.width));
    observer.observe(el);
    return () => observer.disconnect();
  }, [ref]);
  return width;
}

/** How long after a jump the view's own scroll events leave the page count alone. */
const JUMP_SETTLE_MS = 400;

export function scaleFor(zoom: Zoom, containerWidth: number, pageWidth: number): number {
  if (zoom !== 'fit') return zoom;
  if (containerWidth <= 0 || pageWidth <= 0) return 1;
  return Math.max(0.25, Math.min(4, (containerWidth - FIT_ALLOWANCE) / pageWidth));
}

export function PdfPages({
  doc,
  fileName,
  zoom,
  onScale,
  jump,
  currentPage,
  onPageChange,
  onPick,
  markups,
  renderLayer,
}: {
  doc: PdfDocument;
  fileName: string;
  zoom: Zoom;
  onScale: (scale: number) => void;
  jump: Jump | null;
  currentPage: number;
  onPageChange: (page: number) => void;
  onPick: (page: number) => void;
  markups: Markup[];
  renderLayer: (pageNumber: number, viewport: PdfViewport) => ReactNode;
}) {
  const pages = usePages(doc);
  const scroller = useRef<HTMLDivElement>(null);
  const pageEls = useRef(new Map<number, HTMLDivElement>());
  const jumpedAt = useRef(0);
  const width = useWidth(scroller);
  const first = pages[0] ?? null;
  const baseWidth = useMemo(() => first?.getViewport({ scale: 1 }).width ?? 0, [first]);
  const scale = scaleFor(zoom, width, baseWidth);
  const viewports = useMemo(() => pages.map((page) => page?.getViewport({ scale }) ?? null), [pages, scale]);
  const fallback = viewports[0] ?? null;

  useEffect(() => onScale(scale), [scale, onScale]);

  // Jump to a page (and a markup on it) when asked.
  useEffect(() => {
    if (!jump) return;
    const el = pageEls.current.get(jump.page);
    const box = scroller.current;
    if (!el || !box) return;
    let offset = 0;
    const viewport = viewports[jump.page - 1];
    const markup = jump.markupId ? markups.find((m) => m.id === jump.markupId) : undefined;
    if (markup && viewport) {
      const anchor = markupAnchor(viewport, markup.kind, markup.geometry);
      offset = Math.max(0, anchor.y - box.clientHeight / 3);
    }
    jumpedAt.current = performance.now();
    box.scrollTo?.({ top: el.offsetTop - PAGE_GAP + offset, behavior: 'auto' });
    // Only a new jump (or the first page's size arriving) moves the view; a zoom change
    // keeps the reader's place.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [jump?.nonce, first]);

  // A new zoom keeps the page being read at the top of the view.
  useEffect(() => {
    const el = pageEls.current.get(currentPage);
    if (el && scroller.current) scroller.current.scrollTop = el.offsetTop - PAGE_GAP;
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [scale]);

  function onScroll() {
    const box = scroller.current;
    if (!box) return;
    // The scroll a jump itself causes (and the page layout settling right after it) does not
    // move the page count away from the page the jump asked for.
    if (performance.now() - jumpedAt.current < JUMP_SETTLE_MS) return;
    const line = box.scrollTop + box.clientHeight / 3;
    let seen = 1;
    for (const [n, el] of pageEls.current) if (el.offsetTop <= line && n > seen) seen = n;
    if (seen !== currentPage) onPageChange(seen);
  }

  return (
    <div className="flex min-h-0 min-w-0 flex-1">
      <nav
        aria-label={`Pages of ${fileName}`}
        className="hidden w-[116px] shrink-0 xl:block overflow-y-auto border-r border-rule bg-sheet-alt px-2 py-2"
      >
        <ol className="flex flex-col gap-2">
          {Array.from({ length: doc.numPages }, (_, i) => i + 1).map((n) => {
            const page = pages[n - 1];
            const base = page?.getViewport({ scale: 1 });
            const thumb = page && base ? page.getViewport({ scale: THUMB_WIDTH / base.width }) : null;
            const active = n === currentPage;
            return (
              <li key={n}>
                <button
                  type="button"
                  aria-current={active ? 'page' : undefined}
                  aria-label={`Page ${n} of ${doc.numPages}`}
                  onClick={() => onPick(n)}
                  className={`block w-full border-2 p-0.5 text-center ${active ? 'border-verdigris bg-verdigris-tint' : 'border-transparent hover:border-rule-strong'}`}
                >
                  <span className="relative mx-auto block bg-sheet shadow-sm" style={{ width: THUMB_WIDTH }}>
                    {thumb && page ? (
                      <PdfCanvas page={page} viewport={thumb} label="" />
                    ) : (
                      <span className="block h-[118px]" />
                    )}
                  </span>
                  <span
                    className={`mt-0.5 block text-[12px] tabular ${active ? 'font-bold text-verdigris-deep' : 'text-ink-soft'}`}
                  >
                    {n}
                  </span>
                </button>
              </li>
            );
          })}
        </ol>
      </nav>
      <div
        ref={scroller}
        onScroll={onScroll}
        className="relative min-w-0 flex-1 overflow-auto bg-[#d8d4ca]"
        // Focusable so the arrow keys scroll the page view without a mouse.
        tabIndex={0}
        role="region"
        aria-label="Page view"
        data-testid="page-scroller"
      >
        <div className="flex w-max min-w-full flex-col items-center gap-4 px-6 py-4">
          {Array.from({ length: doc.numPages }, (_, i) => i + 1).map((n) => {
            const page = pages[n - 1];
            const viewport = viewports[n - 1];
            const size = viewport ?? fallback;
            const near = Math.abs(n - currentPage) <= DRAW_AROUND;
            return (
              <div
                key={n}
                ref={(el) => {
                  if (el) pageEls.current.set(n, el);
                  else pageEls.current.delete(n);
                }}
                data-page={n}
                className="relative shrink-0 bg-sheet shadow-[0_1px_3px_rgba(0,0,0,0.25)]"
                style={{ width: size?.width ?? 612, height: size?.height ?? 792 }}
              >
                {page && viewport && near && (
                  <PdfCanvas
                    page={page}
                    viewport={viewport}
                    label={`Page ${n} of ${doc.numPages}, ${fileName}`}
                  />
                )}
                {viewport && renderLayer(n, viewport)}
                <span className="pointer-events-none absolute -left-0.5 top-0 -translate-x-full pr-1.5 text-[11.5px] font-bold text-ink-soft tabular">
                  {n}
                </span>
              </div>
            );
          })}
        </div>
      </div>
    </div>
  );
}

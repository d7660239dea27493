// The only door to pdf.js. It is imported on demand, so the ~750 kB viewer and its worker
// load only when someone opens the review workspace. The rest of the workspace talks to
// the small interfaces below (which tests replace, since jsdom has no canvas).
import type { PointConverter } from './geometry';

export interface PdfViewport extends PointConverter {
  width: number;
  height: number;
  scale: number;
}

export interface PdfRenderTask {
  promise: Promise<void>;
  cancel(): void;
}

export interface PdfPage {
  getViewport(options: { scale: number }): PdfViewport;
  render(options: {
    canvas: HTMLCanvasElement;
    canvasContext: CanvasRenderingContext2D;
    viewport: PdfViewport;
    transform?: number[];
    /** pdf.js's AnnotationMode: 0 draws the page content alone. */
    annotationMode?: number;
  }): PdfRenderTask;
}

export interface PdfDocument {
  numPages: number;
  getPage(pageNumber: number): Promise<PdfPage>;
  destroy(): Promise<void> | void;
}

export interface PdfLoad {
  promise: Promise<PdfDocument>;
  cancel(): void;
}

export type LoadProgress = { loaded: number; total: number };

export function loadPdf(url: string, onProgress?: (progress: LoadProgress) => void): PdfLoad {
  let task: { destroy(): Promise<void> } | null = null;
  let cancelled = false;
  const promise = (async () => {
    const [pdfjs, worker] = await Promise.all([
      import('pdfjs-dist'),
      import('pdfjs-dist/build/pdf.worker.min.mjs?url'),
    ]);
    if (!pdfjs.GlobalWorkerOptions.workerSrc) pdfjs.GlobalWorkerOptions.workerSrc = worker.default;
    const loading = pdfjs.getDocument({ url, withCredentials: true });
    task = loading;
    if (cancelled) void loading.destroy();
    if (onProgress) loading.onProgress = (p: LoadProgress) => onProgress(p);
    return (await loading.promise) as unknown as PdfDocument;
  })();
  return {
    promise,
    cancel: () => {
      cancelled = true;
      void task?.destroy();
    },
  };
}

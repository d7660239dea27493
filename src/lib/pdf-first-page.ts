// Page 1 of a PDF the API makes on request (the stamped return's preview), drawn into a canvas
// with pdf.js. pdf.js is imported on demand (a large chunk), as in the review workspace; tests
// replace this module, since jsdom has no canvas.
export interface FirstPage {
  /** Resolves once page 1 is drawn; rejects with the API's message when the PDF cannot be made. */
  promise: Promise<void>;
  cancel(): void;
}

export function renderFirstPage(url: string, canvas: HTMLCanvasElement, cssWidth: number): FirstPage {
  const controller = new AbortController();
  let destroy: (() => void) | null = null;
  const promise = (async () => {
    const res = await fetch(url, { credentials: 'same-origin', signal: controller.signal });
    if (!res.ok) {
      const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
      throw new Error(body?.error?.message ?? `The preview could not be made (${res.status}).`);
    }
    const data = new Uint8Array(await res.arrayBuffer());
    const [pdfjs, worker] = await Promise.all([
      import('pdfjs-dist'),
      import('pdfjs-dist/build/pdf.worker.min.mjs?url'),
    ]);
    if (!pdfjs.GlobalWorkerOptions.workerSrc) pdfjs.GlobalWorkerOptions.workerSrc = worker.default;
    const loading = pdfjs.getDocument({ data });
    destroy = () => void loading.destroy();
    const doc = await loading.promise;
    const page = await doc.getPage(1);
    const base = page.getViewport({ scale: 1 });
    const ratio = window.devicePixelRatio || 1;
    const viewport = page.getViewport({ scale: (cssWidth / base.width) * ratio });
    canvas.width = Math.round(viewport.width);
    canvas.height = Math.round(viewport.height);
    canvas.style.width = `${cssWidth}px`;
    canvas.style.height = `${Math.round(viewport.height / ratio)}px`;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw the preview.');
    await page.render({ canvas, canvasContext: context, viewport }).promise;
  })();
  return {
    promise,
    cancel: () => {
      controller.abort();
      destroy?.();
    },
  };
}

// One page of a PDF drawn onto a canvas at a viewport, sharp on high-density screens. The
// render is cancelled when the page, zoom or component changes. Only the page's content is
// drawn, never the PDF's own annotations (comments, stamps, shapes, form fields): the stamped
// return does not carry them, and the engineer reviews exactly what it will print.
import { useEffect, useRef, useState } from 'react';
import type { PdfPage, PdfViewport } from '../lib/pdf-loader';

// pdf.js's AnnotationMode.DISABLE (this module does not import pdf.js: it loads on demand).
const ANNOTATIONS_OFF = 0;

export function PdfCanvas({
  page,
  viewport,
  label,
  className = '',
}: {
  page: PdfPage;
  viewport: PdfViewport;
  label: string;
  className?: string;
}) {
  const ref = useRef<HTMLCanvasElement>(null);
  const [failed, setFailed] = useState(false);

  useEffect(() => {
    const canvas = ref.current;
    const context = canvas?.getContext?.('2d');
    if (!canvas || !context) return;
    const ratio = window.devicePixelRatio || 1;
    canvas.width = Math.floor(viewport.width * ratio);
    canvas.height = Math.floor(viewport.height * ratio);
    const task = page.render({
      canvas,
      canvasContext: context,
      viewport,
      transform: ratio === 1 ? undefined : [ratio, 0, 0, ratio, 0, 0],
      annotationMode: ANNOTATIONS_OFF,
    });
    task.promise.then(
      () => setFailed(false),
      (error: unknown) => {
        if (error instanceof Error && error.name === 'RenderingCancelledException') return;
        setFailed(true);
      },
    );
    return () => task.cancel();
  }, [page, viewport]);

  return (
    <>
      <canvas
        ref={ref}
        // A thumbnail inside its labelled button has no label of its own: it is decoration.
        role={label ? 'img' : undefined}
        aria-label={label || undefined}
        aria-hidden={label ? undefined : true}
        className={`block ${className}`}
        style={{ width: viewport.width, height: viewport.height }}
      />
      {failed && (
        <p className="absolute inset-x-0 top-1/3 text-center text-[13px] font-bold text-fail-ink">
          This page could not be drawn.
        </p>
      )}
    </>
  );
}

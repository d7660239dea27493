// Loads one PDF through pdf.js (imported on demand) and reports the bytes as they arrive.
// A new URL cancels the previous load; the document is destroyed when it is no longer shown.
import { useEffect, useState } from 'react';
import { loadPdf, type LoadProgress, type PdfDocument } from '../lib/pdf-loader';

export type PdfState =
  | { status: 'loading'; url: string; progress: LoadProgress | null }
  | { status: 'ready'; url: string; doc: PdfDocument }
  | { status: 'error'; url: string; message: string };

export function usePdfDocument(url: string): PdfState {
  const [state, setState] = useState<PdfState>({ status: 'loading', url, progress: null });

  useEffect(() => {
    let live = true;
    let loaded: PdfDocument | null = null;
    const load = loadPdf(url, (progress) => {
      if (live) setState({ status: 'loading', url, progress });
    });
    load.promise.then(
      (doc) => {
        loaded = doc;
        if (live) setState({ status: 'ready', url, doc });
        else void doc.destroy();
      },
      (error: unknown) => {
        if (!live) return;
        const name = error instanceof Error ? error.name : '';
        setState({
          status: 'error',
          url,
          message:
            name === 'MissingPDFException' || name === 'ResponseException'
              ? 'The server did not send the file. It may have been removed; reload the page.'
              : name === 'InvalidPDFException'
                ? 'The file is not a readable PDF.'
                : 'The PDF viewer could not open this file. Reload the page; if it persists, download the file instead.',
        });
      },
    );
    return () => {
      live = false;
      load.cancel();
      if (loaded) void loaded.destroy();
    };
  }, [url]);

  // A state left over from the previous file reads as loading until the new one answers.
  return state.url === url ? state : { status: 'loading', url, progress: null };
}

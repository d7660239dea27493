// Which document of the revision is open, the page in view, the zoom, and the "jump" that
// tells the page column to scroll (a page, or a markup on it). Paging by key, by button or
// from a finding all go through here so the page count and the column agree.
import { useState } from 'react';
import type { PackageDetail } from '@shared/schemas/packages';
import { nextZoom } from '../lib/tools';
import type { Jump, Zoom } from '../components/pdf-pages';

type RevisionFile = PackageDetail['current']['files'][number];

function jumpTo(page: number, markupId: string | null): Jump {
  // A fresh nonce makes a second jump to the same page scroll again.
  return { page, markupId, nonce: Date.now() + Math.random() };
}

export function useDocumentView(files: RevisionFile[]) {
  const [fileId, setFileId] = useState<string | null>(
    (files.find((f) => f.kind === 'lift_plan') ?? files[0])?.id ?? null,
  );
  const [zoom, setZoom] = useState<Zoom>('fit');
  const [scale, setScale] = useState(1);
  const [page, setPage] = useState(1);
  const [jump, setJump] = useState<Jump | null>(null);

  const file = files.find((f) => f.id === fileId) ?? null;
  const pages = file?.pages ?? 0;

  function goToPage(n: number) {
    if (!file) return;
    const target = Math.max(1, Math.min(pages || 1, n));
    setPage(target);
    setJump(jumpTo(target, null));
  }

  /** Open a file at a page (and a markup on it), as following a finding does. */
  function show(targetFileId: string, targetPage: number, markupId: string | null) {
    setFileId(targetFileId);
    setPage(targetPage);
    setJump(jumpTo(targetPage, markupId));
  }

  function chooseFile(id: string) {
    setFileId(id);
    setPage(1);
  }

  return {
    file,
    fileId,
    page,
    pages,
    zoom,
    scale,
    jump,
    setPage,
    setScale,
    setZoom,
    zoomBy: (direction: 1 | -1) => setZoom(nextZoom(scale, direction)),
    goToPage,
    show,
    chooseFile,
  };
}

export type DocumentViewState = ReturnType<typeof useDocumentView>;

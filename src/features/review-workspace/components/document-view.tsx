// The open document: its pages as pdf.js draws them (with progress while the file comes in,
// and a way out when it cannot be shown), each page with its markup layer on top.
import type { PackageDetail } from '@shared/schemas/packages';
import type { Markup } from '@shared/schemas/reviews';
import { Spinner } from '@/components/ui/page-loading';
import type { DocumentViewState } from '../hooks/use-document-view';
import type { MarkupEditing } from '../hooks/use-markup-editing';
import { usePdfDocument } from '../hooks/use-pdf-document';
import { MarkupLayer } from './markup-layer';
import { PdfPages } from './pdf-pages';
import { StampOutline } from './stamp-outline';
import type { StampPlacementBody, StampPlacementView } from '@shared/schemas/stamp-placement';

/** The stamp block's outline on page 1 of the plan (stamp-outline.tsx). */
export type StampControls = {
  view: StampPlacementView | undefined;
  editable: boolean;
  saving: boolean;
  error: string | null;
  onPlace: (at: StampPlacementBody) => void;
  onReset: () => void;
};

type RevisionFile = PackageDetail['current']['files'][number];

const backdrop = 'flex flex-1 items-center justify-center bg-[#d8d4ca] text-[13px]';

function fileUrl(packageId: string, fileId: string) {
  return `/api/packages/${encodeURIComponent(packageId)}/files/${encodeURIComponent(fileId)}`;
}

function OpenDocument({
  packageId,
  file,
  view,
  markups,
  editing,
  editable,
  stamp,
}: {
  packageId: string;
  file: RevisionFile;
  view: DocumentViewState;
  markups: Markup[];
  editing: MarkupEditing;
  editable: boolean;
  stamp: StampControls;
}) {
  const state = usePdfDocument(fileUrl(packageId, file.id));
  if (state.status === 'loading') {
    const p = state.progress;
    return (
      <div role="status" className={`${backdrop} gap-2 text-ink-soft`}>
        <Spinner />
        Opening {file.originalName}
        {p && p.total > 0 && ` — ${Math.round(p.loaded / 1024)} of ${Math.round(p.total / 1024)} kB`}…
      </div>
    );
  }
  if (state.status === 'error') {
    return (
      <div role="alert" className={`${backdrop} flex-col gap-2 px-6 text-center`}>
        <p className="font-bold text-fail-ink">{file.originalName} could not be shown.</p>
        <p>{state.message}</p>
        <a
          className="font-bold text-verdigris underline"
          href={fileUrl(packageId, file.id)}
          target="_blank"
          rel="noreferrer"
        >
          Open the file in a new tab
        </a>
      </div>
    );
  }
  const { pending } = editing;
  return (
    <PdfPages
      doc={state.doc}
      fileName={file.originalName}
      zoom={view.zoom}
      onScale={view.setScale}
      jump={view.jump}
      currentPage={view.page}
      onPageChange={view.setPage}
      onPick={(n) => view.goToPage(n)}
      markups={markups}
      renderLayer={(n, viewport) => (
        <>
          <MarkupLayer
            viewport={viewport}
            fileId={file.id}
            pageNumber={n}
            markups={markups.filter((m) => m.pageNumber === n)}
            tool={editing.tool}
            colour={editing.colour}
            editable={editable}
            selectedId={editing.selectedId}
            onSelect={editing.setSelectedId}
            onCreate={editing.add}
            pending={pending && pending.fileId === file.id && pending.pageNumber === n ? pending : null}
            onPendingStart={(at) => editing.setPending({ fileId: file.id, pageNumber: n, at, value: '' })}
            onPendingChange={(value) => editing.setPending((p) => (p ? { ...p, value } : p))}
            onPendingSave={editing.savePendingText}
            onPendingCancel={() => editing.setPending(null)}
          />
          {n === 1 && stamp.view && stamp.view.fileId === file.id && (
            <StampOutline
              viewport={viewport}
              view={stamp.view}
              editable={stamp.editable}
              active={editing.tool === 'select'}
              saving={stamp.saving}
              error={stamp.error}
              onPlace={stamp.onPlace}
              onReset={stamp.onReset}
            />
          )}
        </>
      )}
    />
  );
}

export function DocumentView(props: {
  packageId: string;
  view: DocumentViewState;
  markups: Markup[];
  editing: MarkupEditing;
  editable: boolean;
  stamp: StampControls;
}) {
  const file = props.view.file;
  if (!file)
    return (
      <div className={`${backdrop} px-6 text-center`}>
        This revision has no PDF. The contractor adds the lift plan before submitting.
      </div>
    );
  // A new document starts from a fresh loader and page list.
  return <OpenDocument key={file.id} file={file} {...props} />;
}

// The bar over the pages: which document, the page in view with previous and next, the zoom,
// the picked markup with its removal, and the list of keys.
import type { PackageDetail } from '@shared/schemas/packages';
import type { Markup } from '@shared/schemas/reviews';
import { Button } from '@/components/ui/button';
import type { DocumentViewState } from '../hooks/use-document-view';
import { KEY_HELP } from '../hooks/use-workspace-keys';
import { markupName } from '../lib/tools';

function FilePicker({
  files,
  view,
  onChoose,
}: {
  files: PackageDetail['current']['files'];
  view: DocumentViewState;
  onChoose: (fileId: string) => void;
}) {
  if (files.length <= 1)
    return view.file && <span className="max-w-[16rem] truncate font-bold">{view.file.originalName}</span>;
  return (
    <label className="flex items-center gap-1">
      <span className="sr-only">Document</span>
      <select
        value={view.fileId ?? ''}
        onChange={(event) => onChoose(event.target.value)}
        className="h-7 max-w-[16rem] border border-rule-strong bg-sheet px-1 text-[13px]"
      >
        {files.map((f) => (
          <option key={f.id} value={f.id}>
            {f.originalName} ({f.pages} {f.pages === 1 ? 'page' : 'pages'})
          </option>
        ))}
      </select>
    </label>
  );
}

function ZoomControls({ view }: { view: DocumentViewState }) {
  return (
    <span role="group" aria-label="Zoom" className="flex items-center gap-1">
      <Button
        size="sm"
        variant={view.zoom === 'fit' ? 'primary' : 'secondary'}
        aria-pressed={view.zoom === 'fit'}
        onClick={() => view.setZoom('fit')}
      >
        Fit width
      </Button>
      <Button
        size="sm"
        variant={view.zoom === 1 ? 'primary' : 'secondary'}
        aria-pressed={view.zoom === 1}
        onClick={() => view.setZoom(1)}
      >
        100%
      </Button>
      <Button size="sm" aria-label="Zoom out" onClick={() => view.zoomBy(-1)}>
        −
      </Button>
      <span className="w-11 text-center tabular" data-testid="zoom-level">
        {Math.round(view.scale * 100)}%
      </span>
      <Button size="sm" aria-label="Zoom in" onClick={() => view.zoomBy(1)}>
        +
      </Button>
    </span>
  );
}

function KeysHelp() {
  return (
    <details className="relative ml-auto">
      <summary className="cursor-pointer text-[12.5px] font-bold text-verdigris">Keys</summary>
      <dl className="absolute right-0 z-20 mt-1 grid w-72 grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 border border-rule-strong bg-sheet p-2 text-[12.5px] shadow-lg">
        {KEY_HELP.map(([keys, what]) => (
          <div key={keys} className="contents">
            <dt className="font-bold">{keys}</dt>
            <dd>{what}</dd>
          </div>
        ))}
      </dl>
    </details>
  );
}

export function DocumentToolbar({
  files,
  view,
  onChooseFile,
  selectedMarkup,
  onRemoveSelected,
  removing,
}: {
  files: PackageDetail['current']['files'];
  view: DocumentViewState;
  onChooseFile: (fileId: string) => void;
  selectedMarkup: Markup | null;
  /** Absent for someone who may not mark up. */
  onRemoveSelected?: () => void;
  removing: boolean;
}) {
  return (
    <div className="flex flex-wrap items-center gap-2 border-b border-rule bg-sheet-alt px-2 py-1 text-[13px]">
      <FilePicker files={files} view={view} onChoose={onChooseFile} />
      {view.file && (
        <span className="flex items-center gap-1">
          <Button
            size="sm"
            variant="quiet"
            aria-label="Previous page"
            disabled={view.page <= 1}
            onClick={() => view.goToPage(view.page - 1)}
          >
            ‹
          </Button>
          <span className="tabular" aria-live="polite">
            Page {view.page} of {view.pages}
          </span>
          <Button
            size="sm"
            variant="quiet"
            aria-label="Next page"
            disabled={view.page >= view.pages}
            onClick={() => view.goToPage(view.page + 1)}
          >
            ›
          </Button>
        </span>
      )}
      <ZoomControls view={view} />
      {selectedMarkup && (
        <span className="flex items-center gap-1.5 border-l border-rule pl-2">
          <span className="font-bold">{markupName(selectedMarkup)}</span>
          {onRemoveSelected && (
            <Button size="sm" variant="quiet" onClick={onRemoveSelected} disabled={removing}>
              Remove (Delete)
            </Button>
          )}
        </span>
      )}
      <KeysHelp />
    </div>
  );
}

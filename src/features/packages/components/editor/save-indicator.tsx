// "Saved 14:02" / "Saving…" / "Not saved — retry", and the choice after another tab saved.
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import type { SaveState } from '../../hooks/use-draft-autosave';

function hhmm(date: Date): string {
  return `${String(date.getHours()).padStart(2, '0')}:${String(date.getMinutes()).padStart(2, '0')}`;
}

export function SaveIndicator({ state, onRetry }: { state: SaveState; onRetry: () => void }) {
  return (
    <span role="status" className="inline-flex items-center gap-1.5 text-[13px]" data-testid="save-state">
      {state.kind === 'saved' && (
        <span className="text-ink-soft">{state.at ? `Saved ${hhmm(state.at)}` : 'All changes saved'}</span>
      )}
      {state.kind === 'pending' && <span className="text-ink-soft">Changes not yet saved</span>}
      {state.kind === 'saving' && (
        <span className="inline-flex items-center gap-1 text-ink-soft">
          <Spinner className="size-3.5" /> Saving…
        </span>
      )}
      {state.kind === 'error' && (
        <>
          <span className="font-bold text-fail-ink" title={state.message}>
            ✕ Not saved
          </span>
          <Button size="sm" onClick={onRetry}>
            Retry
          </Button>
        </>
      )}
      {state.kind === 'conflict' && <span className="font-bold text-caution-ink">▲ Saved elsewhere</span>}
      {state.kind === 'frozen' && <span className="font-bold text-ink">Submitted — read only</span>}
    </span>
  );
}

export function ConflictChoice({ onReload, onKeepMine }: { onReload: () => void; onKeepMine: () => void }) {
  return (
    <div
      role="alertdialog"
      aria-labelledby="conflict-title"
      className="mb-3 border border-caution-ink border-l-4 bg-caution-tint px-4 py-3"
    >
      <h2 id="conflict-title" className="text-[14px] font-bold text-caution-ink">
        This draft was saved from another tab or device
      </h2>
      <p className="mt-1 text-[13px]">
        Someone (perhaps you, elsewhere) saved a newer version while you were editing here. Choose which
        version to keep; the other is discarded.
      </p>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button size="sm" onClick={onReload}>
          Load the saved version
        </Button>
        <Button size="sm" variant="primary" onClick={onKeepMine}>
          Keep mine and save over it
        </Button>
      </div>
    </div>
  );
}

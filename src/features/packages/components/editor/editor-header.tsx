// The editor's title line (reference, revision, site, title, status, save state) and the
// notices autosave raises: another tab saved, the revision was submitted elsewhere, or a
// save failed.
import { Link } from 'react-router-dom';
import type { PackageDetail } from '@shared/schemas/packages';
import { StatusBadge } from '@/components/ui/status-badge';
import type { useDraftAutosave } from '../../hooks/use-draft-autosave';
import { ConflictChoice, SaveIndicator } from './save-indicator';

export function EditorHeader({
  detail,
  title,
  autosave,
}: {
  detail: PackageDetail;
  title: string;
  autosave: ReturnType<typeof useDraftAutosave>;
}) {
  const packageId = detail.package.id;
  return (
    <>
      <header className="mb-3 flex flex-wrap items-end justify-between gap-3 border-b-2 border-ink pb-2.5">
        <div className="min-w-0">
          <p className="font-mono text-[13px] font-bold text-ink-soft">
            {detail.package.reference} · revision {detail.current.number} · {detail.package.site.name}
          </p>
          <h1 className="truncate text-[22px] font-black leading-tight">{title || detail.package.title}</h1>
        </div>
        <div className="flex items-center gap-3">
          <StatusBadge status={detail.package.status} />
          <SaveIndicator state={autosave.state} onRetry={() => void autosave.retry()} />
          <Link
            to={`/packages/${packageId}`}
            className="text-[13px] font-bold text-verdigris underline underline-offset-2"
          >
            Package page
          </Link>
        </div>
      </header>

      {autosave.state.kind === 'conflict' && (
        <ConflictChoice
          onReload={() => void autosave.reloadSaved()}
          onKeepMine={() => void autosave.keepMine()}
        />
      )}
      {autosave.state.kind === 'frozen' && (
        <div
          role="alert"
          className="mb-3 border border-rule border-l-4 border-l-ink bg-sheet px-4 py-3 text-[13px]"
        >
          <strong>This revision has been submitted and can no longer change.</strong> Your last edits here
          were not saved.{' '}
          <Link to={`/packages/${packageId}`} className="font-bold text-verdigris underline">
            Open the package
          </Link>
          .
        </div>
      )}
      {autosave.state.kind === 'error' && (
        <div
          role="alert"
          className="mb-3 border border-failed-edge border-l-4 bg-failed-tint px-4 py-2 text-[13px]"
        >
          <strong className="text-failed-ink">Not saved.</strong> {autosave.state.message} Your changes stay
          in this tab; use Retry beside the save state.
        </div>
      )}
    </>
  );
}

// The engineer of record's review workspace: the package's PDFs on the left (thumbnails,
// pages with their markups, the tool rail), and on the right, in tabs that can be widened,
// the recomputed checks with the disagreeing figures first, the findings, the decision and
// — for a resubmission — what changed since the previous revision. Keyboard first.
// This file composes; the state lives in ../hooks (document view, markup editing, the finding
// being written, the keyboard map) and the pieces in their own files.
import { readStoredResult } from '@shared/engineering/stored-result';
import { useMemo, useState, type ReactNode } from 'react';
import type { CurrentUser } from '@shared/schemas/auth';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { PackageDetail } from '@shared/schemas/packages';
import type { Finding } from '@shared/schemas/reviews';
import { SplitPane } from '@/components/ui/split-pane';
import { TabPanel, Tabs, type TabItem } from '@/components/ui/tabs';
import { isApiError } from '@/lib/api-client';
import { useMarkups } from '../api/markups';
import { useFindings, useSetFindingState } from '@/lib/findings-client';
import { workspaceAccess } from '../lib/permissions';
import { useDocumentView } from '../hooks/use-document-view';
import { useFindingComposer } from '../hooks/use-finding-composer';
import { useMarkupEditing } from '../hooks/use-markup-editing';
import { useReviewSummary } from '../hooks/use-review-summary';
import { useWorkspaceKeys } from '../hooks/use-workspace-keys';
import { CheckPanel, type RaiseFinding } from './check-panel';
import { DecisionForm } from './decision-form';
import { DocumentToolbar } from './document-toolbar';
import { DocumentView, type StampControls } from './document-view';
import { useChangeStampPlacement, useStampPlacement } from '../api/stamp-placement';
import { FindingsPanel } from './findings-panel';
import { RevisionDifference } from './revision-difference';
import { ToolRail } from './tool-rail';
import { WorkspaceHeader } from './workspace-header';

type Tab = 'checks' | 'findings' | 'decision' | 'difference';

const MIN_COLUMN = 340;
const MAX_COLUMN = 900;

const panelClass = 'min-h-0 flex-1 overflow-y-auto';

export function ReviewWorkspace({
  detail,
  user,
  library,
}: {
  detail: PackageDetail;
  user: CurrentUser;
  /** The page's fleet-library panel (versions used, verification), shown on top of the checks */
  library?: ReactNode;
}) {
  const pkg = detail.package;
  const current = detail.current;
  const access = workspaceAccess(user, detail);
  const files = current.files;
  const result = readStoredResult(current.results);
  const markupsQuery = useMarkups(pkg.id);
  const findingsQuery = useFindings(pkg.id);
  const setFindingState = useSetFindingState(pkg.id);

  const view = useDocumentView(files);
  const stampQuery = useStampPlacement(pkg.id, user.role === 'engineer' || user.role === 'reviewer');
  const changeStamp = useChangeStampPlacement(pkg.id);
  const stamp: StampControls = {
    view: stampQuery.data,
    editable: access.canPlaceStamp,
    saving: changeStamp.isPending,
    error: changeStamp.error instanceof Error ? changeStamp.error.message : null,
    onPlace: (at) => changeStamp.mutate(at),
    onReset: () => changeStamp.mutate(null),
  };
  const editing = useMarkupEditing(pkg.id, access.canMarkUp);
  const composer = useFindingComposer(
    pkg.id,
    access.canMarkUp,
    `finding:${user.id}:${pkg.id}:${current.number}`,
  );
  const [selectedFindingId, setSelectedFindingId] = useState<string | null>(null);
  const [tab, setTab] = useState<Tab>('checks');
  // About a third of the screen for the review column; the separator widens or narrows it.
  const [columnWidth] = useState(() =>
    Math.round(Math.min(520, Math.max(MIN_COLUMN, window.innerWidth * 0.3))),
  );
  const [seenVersion, setSeenVersion] = useState(pkg.version);

  const markups = useMemo(() => markupsQuery.data ?? [], [markupsQuery.data]);
  const findings = useMemo(() => findingsQuery.data ?? [], [findingsQuery.data]);
  const fileMarkups = useMemo(() => markups.filter((m) => m.fileId === view.fileId), [markups, view.fileId]);
  const selectedMarkup = markups.find((m) => m.id === editing.selectedId) ?? null;
  const summary = useReviewSummary(detail, result, findings);

  function openFinding(f: Finding) {
    setSelectedFindingId(f.id);
    setTab('findings');
    if (f.fileId && summary.fileNames.has(f.fileId)) {
      editing.setSelectedId(f.markupId);
      const markup = f.markupId ? markups.find((m) => m.id === f.markupId) : undefined;
      view.show(f.fileId, markup?.pageNumber ?? f.pageNumber ?? 1, f.markupId);
    }
  }

  function stepFinding(direction: 1 | -1) {
    const ordered = summary.ordered;
    if (ordered.length === 0) return;
    const at = ordered.findIndex((f) => f.id === selectedFindingId);
    const next =
      at === -1
        ? direction === 1
          ? 0
          : ordered.length - 1
        : (at + direction + ordered.length) % ordered.length;
    openFinding(ordered[next]);
  }

  function raiseFinding(raise: RaiseFinding) {
    composer.raise(raise);
    setTab('findings');
    window.setTimeout(() => document.getElementById('finding-text')?.focus(), 0);
  }

  // Ctrl+S saves the text markup being typed, else the finding being written.
  function save() {
    if (!editing.savePendingText()) composer.save();
  }

  useWorkspaceKeys({
    save,
    nextPage: () => view.goToPage(view.page + 1),
    previousPage: () => view.goToPage(view.page - 1),
    nextFinding: () => stepFinding(1),
    previousFinding: () => stepFinding(-1),
    removeSelected: editing.selectedId ? editing.removeSelected : null,
    drop: editing.drop,
    zoomIn: () => view.zoomBy(1),
    zoomOut: () => view.zoomBy(-1),
    zoomActual: () => view.setZoom(1),
    pickTool: access.canMarkUp ? editing.setTool : null,
  });

  const tabs: TabItem<Tab>[] = [
    { id: 'checks', label: 'Checks', count: result ? `${summary.openDiscrepancies} to settle` : undefined },
    { id: 'findings', label: 'Findings', count: `${summary.openFindings} not closed` },
    { id: 'decision', label: 'Decision', count: pkg.decision ? DECISION_LABELS[pkg.decision] : undefined },
    ...(current.number > 1
      ? [{ id: 'difference' as const, label: `Since revision ${current.number - 1}` }]
      : []),
  ];

  const pages = (
    <section aria-label="Pages" className="flex min-h-0 min-w-0 flex-1 flex-col">
      <DocumentToolbar
        files={files}
        view={view}
        onChooseFile={(id) => {
          view.chooseFile(id);
          editing.clear();
        }}
        selectedMarkup={selectedMarkup}
        onRemoveSelected={access.canMarkUp ? editing.removeSelected : undefined}
        removing={editing.removing}
      />
      {editing.error && (
        <p
          role="alert"
          className="border-b border-failed-edge bg-failed-tint px-3 py-1 text-[12.5px] font-bold text-failed-ink"
        >
          {isApiError(editing.error) ? editing.error.message : 'The markup could not be saved.'}
        </p>
      )}
      <div className="flex min-h-0 min-w-0 flex-1">
        {access.canMarkUp && (
          <ToolRail
            tool={editing.tool}
            onTool={editing.setTool}
            colour={editing.colour}
            onColour={editing.setColour}
            disabled={!view.file}
          />
        )}
        <DocumentView
          packageId={pkg.id}
          view={view}
          markups={fileMarkups}
          editing={editing}
          editable={access.canMarkUp}
          stamp={stamp}
        />
      </div>
    </section>
  );

  const review = (
    <aside aria-label="Review" className="flex min-h-0 flex-1 flex-col">
      <Tabs
        value={tab}
        onChange={setTab}
        label="Review panels"
        tabs={tabs}
        className="flex min-h-0 flex-1 flex-col"
      >
        <TabPanel value="checks" className={panelClass}>
          {library && <div className="px-3 pt-3">{library}</div>}
          <CheckPanel
            packageId={pkg.id}
            result={result}
            system={user.unitSystem}
            accepted={summary.accepted}
            editable={access.canMarkUp}
            findingsByCheck={summary.findingsByCheck}
            onRaise={raiseFinding}
            onAccepted={setSeenVersion}
          />
        </TabPanel>
        <TabPanel value="findings" className={panelClass}>
          {findingsQuery.isError ? (
            <p role="alert" className="px-3 py-3 text-[13px] font-bold text-fail-ink">
              {isApiError(findingsQuery.error)
                ? findingsQuery.error.message
                : 'The findings could not be loaded.'}
            </p>
          ) : (
            <FindingsPanel
              findings={findings}
              currentRevision={current.number}
              markups={markups}
              fileNames={summary.fileNames}
              checkLabels={summary.checkLabels}
              editable={access.canMarkUp}
              canChangeState={access.canChangeFindings}
              draft={composer.draft}
              onDraftChange={composer.setDraft}
              onSave={composer.save}
              saving={composer.saving}
              saveError={composer.error}
              selectedMarkup={selectedMarkup}
              currentPage={view.page}
              currentFileId={view.fileId}
              selectedFindingId={selectedFindingId}
              onOpen={openFinding}
              onSetState={(f, state) => setFindingState.mutate({ findingId: f.id, state })}
              stateError={setFindingState.error}
            />
          )}
        </TabPanel>
        <TabPanel value="decision" className={panelClass}>
          <DecisionForm
            detail={detail}
            canDecide={access.canDecide}
            readOnlyReason={access.reason}
            seenVersion={seenVersion}
            onSeen={setSeenVersion}
            openFindings={summary.openFindings}
            openDiscrepancies={summary.openDiscrepancies}
            blockers={summary.blockers}
          />
        </TabPanel>
        {current.number > 1 && (
          <TabPanel value="difference" className={panelClass}>
            {/* Fetched only when opened: most visits never look. */}
            {tab === 'difference' && (
              <RevisionDifference
                packageId={pkg.id}
                revision={current.number}
                system={user.unitSystem}
                findings={findings}
              />
            )}
          </TabPanel>
        )}
      </Tabs>
    </aside>
  );

  return (
    <div className="-mx-3 -mt-2 flex h-[calc(100vh-5.5rem)] min-h-[34rem] flex-col">
      <WorkspaceHeader detail={detail} readOnlyReason={access.reason} />
      <SplitPane
        className="min-h-0 flex-1 border-x border-b border-rule bg-sheet"
        first={pages}
        second={review}
        secondDefault={columnWidth}
        secondMin={MIN_COLUMN}
        secondMax={MAX_COLUMN}
        separatorLabel="Width of the review column"
      />
    </div>
  );
}

// The engineer of record's review workspace: the package's PDFs on the left (thumbnails,
// pages with their markups, the tool rail), and on the right, in tabs that can be widened,
// the recomputed checks with the disagreeing figures first, the findings, the decision and
// — for a resubmission — what changed since the previous revision. Keyboard first.
import { useEffect, useEffectEvent, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { CurrentUser } from '@shared/schemas/auth';
import { DECISION_LABELS } from '@shared/schemas/common';
import type { LiftResult } from '@shared/engineering/types';
import type { PackageDetail } from '@shared/schemas/packages';
import type { Finding, Markup, MarkupBody, MarkupColour } from '@shared/schemas/reviews';
import { StatusBadge } from '@/components/ui/status-badge';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page-loading';
import { isApiError } from '@/lib/api-client';
import { useCreateMarkup, useDeleteMarkup, useMarkups } from '../api/markups';
import { useCreateFinding, useFindings, useSetFindingState } from '../api/findings';
import { acceptedFigures, figureCheckId } from '../lib/accepted-figures';
import { workspaceAccess } from '../lib/permissions';
import { markupName, nextZoom, type Tool, TOOLS } from '../lib/tools';
import { usePdfDocument } from '../hooks/use-pdf-document';
import { CheckPanel, type RaiseFinding } from './check-panel';
import { DecisionForm } from './decision-form';
import { EMPTY_DRAFT, FindingsPanel, MIN_FINDING, type FindingDraft } from './findings-panel';
import { MarkupLayer, TEXT_SIZE, type PendingText } from './markup-layer';
import { PdfPages, type Jump, type Zoom } from './pdf-pages';
import { RevisionDifference } from './revision-difference';
import { ToolRail } from './tool-rail';

type Tab = 'checks' | 'findings' | 'decision' | 'difference';

const MIN_COLUMN = 340;
const MAX_COLUMN = 900;

function isLiftResult(value: unknown): value is LiftResult {
  const v = value as Partial<LiftResult> | null;
  return Boolean(v && Array.isArray(v.checks) && Array.isArray(v.discrepancies) && v.figures);
}

function isTyping(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName);
}

function fileUrl(packageId: string, fileId: string) {
  return `/api/packages/${encodeURIComponent(packageId)}/files/${encodeURIComponent(fileId)}`;
}

function DocumentView({
  packageId,
  file,
  ...rest
}: {
  packageId: string;
  file: { id: string; originalName: string };
} & Omit<Parameters<typeof PdfPages>[0], 'doc' | 'fileName'>) {
  const state = usePdfDocument(fileUrl(packageId, file.id));
  if (state.status === 'loading') {
    const p = state.progress;
    return (
      <div
        role="status"
        className="flex flex-1 items-center justify-center gap-2 bg-[#d8d4ca] text-[13px] text-ink-soft"
      >
        <Spinner />
        Opening {file.originalName}
        {p && p.total > 0 && ` — ${Math.round(p.loaded / 1024)} of ${Math.round(p.total / 1024)} kB`}…
      </div>
    );
  }
  if (state.status === 'error') {
    return (
      <div
        role="alert"
        className="flex flex-1 flex-col items-center justify-center gap-2 bg-[#d8d4ca] px-6 text-center text-[13px]"
      >
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
  return <PdfPages doc={state.doc} fileName={file.originalName} {...rest} />;
}

export function ReviewWorkspace({ detail, user }: { detail: PackageDetail; user: CurrentUser }) {
  const pkg = detail.package;
  const current = detail.current;
  const access = workspaceAccess(user, detail);
  const files = current.files;
  const result = isLiftResult(current.results) ? current.results : null;
  const markupsQuery = useMarkups(pkg.id);
  const findingsQuery = useFindings(pkg.id);
  const createMarkup = useCreateMarkup(pkg.id);
  const deleteMarkup = useDeleteMarkup(pkg.id);
  const createFinding = useCreateFinding(pkg.id);
  const setFindingState = useSetFindingState(pkg.id);

  const [fileId, setFileId] = useState<string | null>(
    (files.find((f) => f.kind === 'lift_plan') ?? files[0])?.id ?? null,
  );
  const [zoom, setZoom] = useState<Zoom>('fit');
  const [scale, setScale] = useState(1);
  const [page, setPage] = useState(1);
  const [jump, setJump] = useState<Jump | null>(null);
  const [tool, setTool] = useState<Tool>('select');
  const [colour, setColour] = useState<MarkupColour>('rust');
  const [selectedMarkupId, setSelectedMarkupId] = useState<string | null>(null);
  const [selectedFindingId, setSelectedFindingId] = useState<string | null>(null);
  const [pending, setPending] = useState<PendingText | null>(null);
  const [draft, setDraft] = useState<FindingDraft>(EMPTY_DRAFT);
  const [tab, setTab] = useState<Tab>('checks');
  // About a third of the screen for the review column; the separator widens or narrows it.
  const [width, setWidth] = useState(() =>
    Math.round(Math.min(520, Math.max(MIN_COLUMN, window.innerWidth * 0.3))),
  );
  const [seenVersion, setSeenVersion] = useState(pkg.version);

  const file = files.find((f) => f.id === fileId) ?? null;
  const markups = useMemo(() => markupsQuery.data ?? [], [markupsQuery.data]);
  const findings = useMemo(() => findingsQuery.data ?? [], [findingsQuery.data]);
  const fileMarkups = useMemo(() => markups.filter((m) => m.fileId === fileId), [markups, fileId]);
  const selectedMarkup = markups.find((m) => m.id === selectedMarkupId) ?? null;
  const accepted = useMemo(() => acceptedFigures(detail), [detail]);
  const fileNames = useMemo(() => new Map(files.map((f) => [f.id, f.originalName])), [files]);
  const checkLabels = useMemo(() => {
    const labels = new Map<string, string>();
    for (const c of result?.checks ?? []) labels.set(c.id, c.label);
    for (const d of result?.discrepancies ?? [])
      labels.set(figureCheckId(d.figure), `Stated figure: ${d.label}`);
    return labels;
  }, [result]);
  const findingsByCheck = useMemo(() => {
    const counts = new Map<string, number>();
    for (const f of findings)
      if (f.checkId && f.revisionNumber === current.number)
        counts.set(f.checkId, (counts.get(f.checkId) ?? 0) + 1);
    return counts;
  }, [findings, current.number]);
  const ordered = useMemo(
    () => [
      ...findings.filter((f) => f.revisionNumber === current.number),
      ...findings.filter((f) => f.revisionNumber < current.number),
    ],
    [findings, current.number],
  );
  const openFindings = findings.filter((f) => f.state !== 'closed').length;
  const openDiscrepancies =
    result?.discrepancies.filter((d) => d.status === 'discrepancy' && !accepted.has(d.figure)).length ?? 0;
  const pages = file?.pages ?? 0;

  function goToPage(n: number, markupId: string | null = null) {
    if (!file) return;
    const target = Math.max(1, Math.min(pages || 1, n));
    setPage(target);
    setJump({ page: target, markupId, nonce: Date.now() + Math.random() });
  }

  function openFinding(f: Finding) {
    setSelectedFindingId(f.id);
    setTab('findings');
    if (f.fileId && fileNames.has(f.fileId)) {
      setFileId(f.fileId);
      setSelectedMarkupId(f.markupId);
      const markup = f.markupId ? markups.find((m) => m.id === f.markupId) : undefined;
      const target = markup?.pageNumber ?? f.pageNumber ?? 1;
      setPage(target);
      setJump({ page: target, markupId: f.markupId, nonce: Date.now() + Math.random() });
    }
  }

  function stepFinding(direction: 1 | -1) {
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

  function addMarkup(body: MarkupBody) {
    createMarkup.mutate(body, { onSuccess: (saved: Markup) => setSelectedMarkupId(saved.id) });
  }

  function savePendingText() {
    if (!pending) return false;
    const text = pending.value.trim();
    if (!text) {
      setPending(null);
      return true;
    }
    createMarkup.mutate(
      {
        kind: 'text',
        fileId: pending.fileId,
        pageNumber: pending.pageNumber,
        colour,
        geometry: { ...pending.at, fontSize: TEXT_SIZE },
        text,
      },
      {
        onSuccess: (saved) => {
          setPending(null);
          setSelectedMarkupId(saved.id);
        },
      },
    );
    return true;
  }

  function saveFinding() {
    if (!access.canMarkUp || draft.text.trim().length < MIN_FINDING || createFinding.isPending) return;
    createFinding.mutate(
      {
        text: draft.text.trim(),
        severity: draft.severity,
        checkId: draft.checkId,
        markupId: draft.markupId,
        fileId: draft.fileId,
        pageNumber: draft.pageNumber,
      },
      { onSuccess: () => setDraft({ ...EMPTY_DRAFT, severity: draft.severity }) },
    );
  }

  function savePending() {
    if (savePendingText()) return;
    saveFinding();
  }

  function raiseFinding(raise: RaiseFinding) {
    setDraft({ ...draft, checkId: raise.checkId, checkLabel: raise.label, text: draft.text || raise.text });
    setTab('findings');
    window.setTimeout(() => document.getElementById('finding-text')?.focus(), 0);
  }

  function removeSelected() {
    if (!access.canMarkUp || !selectedMarkupId) return;
    const id = selectedMarkupId;
    deleteMarkup.mutate(id, { onSuccess: () => setSelectedMarkupId((s) => (s === id ? null : s)) });
  }

  const onKey = useEffectEvent((event: KeyboardEvent) => {
    const mod = event.ctrlKey || event.metaKey;
    if (mod && event.key.toLowerCase() === 's') {
      event.preventDefault();
      savePending();
      return;
    }
    if (mod || event.altKey || isTyping(event.target)) return;
    const key = event.key;
    if (key === 'PageDown' || key === ']') {
      event.preventDefault();
      goToPage(page + 1);
    } else if (key === 'PageUp' || key === '[') {
      event.preventDefault();
      goToPage(page - 1);
    } else if (key === 'n') {
      stepFinding(1);
    } else if (key === 'p') {
      stepFinding(-1);
    } else if (key === 's') {
      event.preventDefault();
      savePending();
    } else if ((key === 'Delete' || key === 'Backspace') && selectedMarkupId) {
      event.preventDefault();
      removeSelected();
    } else if (key === 'Escape') {
      setPending(null);
      setSelectedMarkupId(null);
      setTool('select');
    } else if (key === '+' || key === '=') {
      setZoom(nextZoom(scale, 1));
    } else if (key === '-') {
      setZoom(nextZoom(scale, -1));
    } else if (key === '0') {
      setZoom(1);
    } else if (access.canMarkUp) {
      const t = TOOLS.find((x) => x.key === key);
      if (t) setTool(t.tool);
    }
  });

  useEffect(() => {
    const listener = (event: KeyboardEvent) => onKey(event);
    window.addEventListener('keydown', listener);
    return () => window.removeEventListener('keydown', listener);
  }, []);

  const markupError = createMarkup.error ?? deleteMarkup.error;
  const tabs: { id: Tab; label: string; count?: string }[] = [
    { id: 'checks', label: 'Checks', count: result ? `${openDiscrepancies} to settle` : undefined },
    { id: 'findings', label: 'Findings', count: `${openFindings} not closed` },
    { id: 'decision', label: 'Decision', count: pkg.decision ? DECISION_LABELS[pkg.decision] : undefined },
    ...(current.number > 1
      ? [{ id: 'difference' as const, label: `Since revision ${current.number - 1}` }]
      : []),
  ];

  return (
    <div className="-mx-3 -mt-2 flex h-[calc(100vh-5.5rem)] min-h-[34rem] flex-col">
      <header className="flex flex-wrap items-center gap-x-3 gap-y-1 border-b-2 border-ink pb-1.5">
        <Link
          to={`/packages/${pkg.id}`}
          className="text-[13px] font-bold text-verdigris underline underline-offset-2"
        >
          ← Package
        </Link>
        <span className="font-mono text-[13px] font-bold text-ink-soft">{pkg.reference}</span>
        <h1 className="min-w-0 truncate text-[18px] font-black leading-tight">{pkg.title}</h1>
        <span className="text-[13px] text-ink-soft">Revision {current.number}</span>
        <StatusBadge status={pkg.status} />
        {pkg.decision && <span className="text-[13px] font-bold">{DECISION_LABELS[pkg.decision]}</span>}
        <span className="ml-auto text-[12.5px] text-ink-soft">
          Engineer of record: <strong className="text-ink">{pkg.engineer?.name ?? 'not assigned'}</strong>
        </span>
      </header>
      {access.reason && (
        <p
          role="note"
          data-testid="read-only-note"
          className="border-b border-rule bg-sheet-alt px-3 py-1 text-[12.5px]"
        >
          <span aria-hidden="true" className="mr-1 font-black">
            ◇
          </span>
          {access.reason}
        </p>
      )}

      <div className="flex min-h-0 flex-1 border-x border-b border-rule bg-sheet">
        <section aria-label="Pages" className="flex min-w-0 flex-1 flex-col">
          <div className="flex flex-wrap items-center gap-2 border-b border-rule bg-sheet-alt px-2 py-1 text-[13px]">
            {files.length > 1 ? (
              <label className="flex items-center gap-1">
                <span className="sr-only">Document</span>
                <select
                  value={fileId ?? ''}
                  onChange={(event) => {
                    setFileId(event.target.value);
                    setPage(1);
                    setSelectedMarkupId(null);
                    setPending(null);
                  }}
                  className="h-7 max-w-[16rem] border border-rule-strong bg-sheet px-1 text-[13px]"
                >
                  {files.map((f) => (
                    <option key={f.id} value={f.id}>
                      {f.originalName} ({f.pages} {f.pages === 1 ? 'page' : 'pages'})
                    </option>
                  ))}
                </select>
              </label>
            ) : (
              file && <span className="max-w-[16rem] truncate font-bold">{file.originalName}</span>
            )}
            {file && (
              <span className="flex items-center gap-1">
                <Button
                  size="sm"
                  variant="quiet"
                  aria-label="Previous page"
                  disabled={page <= 1}
                  onClick={() => goToPage(page - 1)}
                >
                  ‹
                </Button>
                <span className="tabular" aria-live="polite">
                  Page {page} of {pages}
                </span>
                <Button
                  size="sm"
                  variant="quiet"
                  aria-label="Next page"
                  disabled={page >= pages}
                  onClick={() => goToPage(page + 1)}
                >
                  ›
                </Button>
              </span>
            )}
            <span role="group" aria-label="Zoom" className="flex items-center gap-1">
              <Button
                size="sm"
                variant={zoom === 'fit' ? 'primary' : 'secondary'}
                aria-pressed={zoom === 'fit'}
                onClick={() => setZoom('fit')}
              >
                Fit width
              </Button>
              <Button
                size="sm"
                variant={zoom === 1 ? 'primary' : 'secondary'}
                aria-pressed={zoom === 1}
                onClick={() => setZoom(1)}
              >
                100%
              </Button>
              <Button size="sm" aria-label="Zoom out" onClick={() => setZoom(nextZoom(scale, -1))}>
                −
              </Button>
              <span className="w-11 text-center tabular" data-testid="zoom-level">
                {Math.round(scale * 100)}%
              </span>
              <Button size="sm" aria-label="Zoom in" onClick={() => setZoom(nextZoom(scale, 1))}>
                +
              </Button>
            </span>
            {selectedMarkup && (
              <span className="flex items-center gap-1.5 border-l border-rule pl-2">
                <span className="font-bold">{markupName(selectedMarkup)}</span>
                {access.canMarkUp && (
                  <Button
                    size="sm"
                    variant="quiet"
                    onClick={removeSelected}
                    disabled={deleteMarkup.isPending}
                  >
                    Remove (Delete)
                  </Button>
                )}
              </span>
            )}
            <details className="relative ml-auto">
              <summary className="cursor-pointer text-[12.5px] font-bold text-verdigris">Keys</summary>
              <dl className="absolute right-0 z-20 mt-1 grid w-72 grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 border border-rule-strong bg-sheet p-2 text-[12.5px] shadow-lg">
                <dt className="font-bold">PageDown ] / PageUp [</dt>
                <dd>next / previous page</dd>
                <dt className="font-bold">n / p</dt>
                <dd>next / previous finding</dd>
                <dt className="font-bold">Ctrl+S or s</dt>
                <dd>save the text being written</dd>
                <dt className="font-bold">1 – 7</dt>
                <dd>markup tools</dd>
                <dt className="font-bold">Delete</dt>
                <dd>remove the picked markup</dd>
                <dt className="font-bold">+ − 0</dt>
                <dd>zoom in, out, 100%</dd>
                <dt className="font-bold">Esc</dt>
                <dd>drop the tool and the pick</dd>
              </dl>
            </details>
          </div>
          {markupError && (
            <p
              role="alert"
              className="border-b border-failed-edge bg-failed-tint px-3 py-1 text-[12.5px] font-bold text-failed-ink"
            >
              {isApiError(markupError) ? markupError.message : 'The markup could not be saved.'}
            </p>
          )}
          <div className="flex min-h-0 min-w-0 flex-1">
            {access.canMarkUp && (
              <ToolRail tool={tool} onTool={setTool} colour={colour} onColour={setColour} disabled={!file} />
            )}
            {file ? (
              <DocumentView
                key={file.id}
                packageId={pkg.id}
                file={file}
                zoom={zoom}
                onScale={setScale}
                jump={jump}
                currentPage={page}
                onPageChange={setPage}
                onPick={(n) => goToPage(n)}
                markups={fileMarkups}
                renderLayer={(n, viewport) => (
                  <MarkupLayer
                    viewport={viewport}
                    fileId={file.id}
                    pageNumber={n}
                    markups={fileMarkups.filter((m) => m.pageNumber === n)}
                    tool={tool}
                    colour={colour}
                    editable={access.canMarkUp}
                    selectedId={selectedMarkupId}
                    onSelect={setSelectedMarkupId}
                    onCreate={addMarkup}
                    pending={
                      pending && pending.fileId === file.id && pending.pageNumber === n ? pending : null
                    }
                    onPendingStart={(at) => setPending({ fileId: file.id, pageNumber: n, at, value: '' })}
                    onPendingChange={(value) => setPending((p) => (p ? { ...p, value } : p))}
                    onPendingSave={savePendingText}
                    onPendingCancel={() => setPending(null)}
                  />
                )}
              />
            ) : (
              <div className="flex flex-1 items-center justify-center bg-[#d8d4ca] px-6 text-center text-[13px]">
                This revision has no PDF. The contractor adds the lift plan before submitting.
              </div>
            )}
          </div>
        </section>

        <div
          role="separator"
          aria-orientation="vertical"
          aria-label="Width of the review column"
          aria-valuemin={MIN_COLUMN}
          aria-valuemax={MAX_COLUMN}
          aria-valuenow={width}
          tabIndex={0}
          onKeyDown={(event) => {
            if (event.key === 'ArrowLeft') setWidth((w) => Math.min(MAX_COLUMN, w + 32));
            if (event.key === 'ArrowRight') setWidth((w) => Math.max(MIN_COLUMN, w - 32));
          }}
          onPointerDown={(event) => {
            const startX = event.clientX;
            const startWidth = width;
            const el = event.currentTarget;
            el.setPointerCapture?.(event.pointerId);
            const move = (e: PointerEvent) =>
              setWidth(Math.max(MIN_COLUMN, Math.min(MAX_COLUMN, startWidth + startX - e.clientX)));
            const up = () => {
              el.removeEventListener('pointermove', move);
              el.removeEventListener('pointerup', up);
            };
            el.addEventListener('pointermove', move);
            el.addEventListener('pointerup', up);
          }}
          className="w-1.5 shrink-0 cursor-col-resize border-x border-rule bg-sheet-alt hover:bg-rule"
        />

        <aside aria-label="Review" className="flex min-h-0 shrink-0 flex-col" style={{ width }}>
          <div
            role="tablist"
            aria-label="Review panels"
            className="flex border-b border-rule-strong bg-sheet-alt"
          >
            {tabs.map((t) => (
              <button
                key={t.id}
                id={`ws-tab-${t.id}`}
                role="tab"
                type="button"
                aria-selected={tab === t.id}
                aria-controls={`ws-panel-${t.id}`}
                onClick={() => setTab(t.id)}
                className={`flex min-w-0 flex-1 flex-col items-start border-b-[3px] px-2.5 py-1 text-left ${
                  tab === t.id ? 'border-rust bg-sheet' : 'border-transparent hover:bg-sheet'
                }`}
              >
                <span className="text-[13px] font-bold">{t.label}</span>
                {t.count && <span className="truncate text-[11.5px] text-ink-soft">{t.count}</span>}
              </button>
            ))}
          </div>
          <div
            role="tabpanel"
            id="ws-panel-checks"
            aria-labelledby="ws-tab-checks"
            hidden={tab !== 'checks'}
            className="min-h-0 flex-1 overflow-y-auto"
          >
            <CheckPanel
              packageId={pkg.id}
              result={result}
              system={user.unitSystem}
              accepted={accepted}
              editable={access.canMarkUp}
              findingsByCheck={findingsByCheck}
              onRaise={raiseFinding}
              onAccepted={setSeenVersion}
            />
          </div>
          <div
            role="tabpanel"
            id="ws-panel-findings"
            aria-labelledby="ws-tab-findings"
            hidden={tab !== 'findings'}
            className="min-h-0 flex-1 overflow-y-auto"
          >
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
                fileNames={fileNames}
                checkLabels={checkLabels}
                editable={access.canMarkUp}
                canChangeState={access.canChangeFindings}
                draft={draft}
                onDraftChange={setDraft}
                onSave={saveFinding}
                saving={createFinding.isPending}
                saveError={createFinding.error}
                selectedMarkup={selectedMarkup}
                currentPage={page}
                currentFileId={fileId}
                selectedFindingId={selectedFindingId}
                onOpen={openFinding}
                onSetState={(f, state) => setFindingState.mutate({ findingId: f.id, state })}
                stateError={setFindingState.error}
              />
            )}
          </div>
          <div
            role="tabpanel"
            id="ws-panel-decision"
            aria-labelledby="ws-tab-decision"
            hidden={tab !== 'decision'}
            className="min-h-0 flex-1 overflow-y-auto"
          >
            <DecisionForm
              detail={detail}
              canDecide={access.canDecide}
              readOnlyReason={access.reason}
              seenVersion={seenVersion}
              onSeen={setSeenVersion}
              openFindings={openFindings}
              openDiscrepancies={openDiscrepancies}
            />
          </div>
          {current.number > 1 && (
            <div
              role="tabpanel"
              id="ws-panel-difference"
              aria-labelledby="ws-tab-difference"
              hidden={tab !== 'difference'}
              className="min-h-0 flex-1 overflow-y-auto"
            >
              {tab === 'difference' && (
                <RevisionDifference
                  packageId={pkg.id}
                  revision={current.number}
                  system={user.unitSystem}
                  findings={findings}
                />
              )}
            </div>
          )}
        </aside>
      </div>
    </div>
  );
}

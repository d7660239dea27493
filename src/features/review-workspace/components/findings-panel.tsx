// Findings: the composer (text, severity, and what it is tied to — a markup, a page or a
// check), this revision's findings, and the ones carried from earlier revisions with the
// contractor's answers. Clicking a finding takes the pages to what it is tied to.
import type { Finding, Markup } from '@shared/schemas/reviews';
import { FINDING_SEVERITIES } from '@shared/schemas/reviews';
import { Button } from '@/components/ui/button';
import { isApiError } from '@/lib/api-client';
import { FindingEntry } from '@/components/findings/finding-entry';
import { SEVERITY_LABELS } from '@/components/findings/finding-marks';
import { markupName } from '../lib/tools';

export type FindingDraft = {
  text: string;
  severity: Finding['severity'];
  checkId: string | null;
  checkLabel: string | null;
  markupId: string | null;
  fileId: string | null;
  pageNumber: number | null;
};

export const EMPTY_DRAFT: FindingDraft = {
  text: '',
  severity: 'minor',
  checkId: null,
  checkLabel: null,
  markupId: null,
  fileId: null,
  pageNumber: null,
};

export const MIN_FINDING = 3;

function LinkChip({
  children,
  onRemove,
  label,
}: {
  children: React.ReactNode;
  onRemove?: () => void;
  label: string;
}) {
  return (
    <span className="inline-flex items-center gap-1 rounded-sm border border-rule-strong bg-sheet px-1.5 text-[12px] leading-5">
      {children}
      {onRemove && (
        <button
          type="button"
          aria-label={`Remove the link to ${label}`}
          onClick={onRemove}
          className="px-0.5 font-black text-ink-soft hover:text-ink"
        >
          ×
        </button>
      )}
    </span>
  );
}

export function FindingTarget({
  finding,
  markups,
  fileNames,
  checkLabels,
}: {
  finding: Pick<Finding, 'markupId' | 'fileId' | 'pageNumber' | 'checkId'>;
  markups: Markup[];
  fileNames: Map<string, string>;
  checkLabels: Map<string, string>;
}) {
  const parts: string[] = [];
  const markup = finding.markupId ? markups.find((m) => m.id === finding.markupId) : undefined;
  if (markup) parts.push(markupName(markup));
  else if (finding.pageNumber) parts.push(`Page ${finding.pageNumber}`);
  if (finding.fileId && fileNames.size > 1) parts.push(fileNames.get(finding.fileId) ?? 'an earlier file');
  if (finding.checkId) parts.push(checkLabels.get(finding.checkId) ?? finding.checkId);
  if (parts.length === 0) return null;
  return <>{parts.join(' · ')}</>;
}

export function FindingsPanel({
  findings,
  currentRevision,
  markups,
  fileNames,
  checkLabels,
  editable,
  canChangeState,
  draft,
  onDraftChange,
  onSave,
  saving,
  saveError,
  selectedMarkup,
  currentPage,
  currentFileId,
  selectedFindingId,
  onOpen,
  onSetState,
  stateError,
}: {
  findings: Finding[];
  currentRevision: number;
  markups: Markup[];
  fileNames: Map<string, string>;
  checkLabels: Map<string, string>;
  editable: boolean;
  canChangeState: boolean;
  draft: FindingDraft;
  onDraftChange: (draft: FindingDraft) => void;
  onSave: () => void;
  saving: boolean;
  saveError: unknown;
  selectedMarkup: Markup | null;
  currentPage: number;
  currentFileId: string | null;
  selectedFindingId: string | null;
  onOpen: (finding: Finding) => void;
  onSetState: (finding: Finding, state: 'open' | 'closed') => void;
  stateError: unknown;
}) {
  const current = findings.filter((f) => f.revisionNumber === currentRevision);
  const carried = findings.filter((f) => f.revisionNumber < currentRevision);
  const draftMarkup = draft.markupId ? markups.find((m) => m.id === draft.markupId) : undefined;
  const tooShort = draft.text.trim().length < MIN_FINDING;

  const item = (f: Finding) => (
    <li
      key={f.id}
      className={`border-b border-rule last:border-b-0 ${f.id === selectedFindingId ? 'bg-verdigris-tint' : ''}`}
      data-testid="finding"
    >
      <div className="flex items-start gap-2 px-3 py-2">
        <button
          type="button"
          onClick={() => onOpen(f)}
          className="min-w-0 flex-1 text-left"
          aria-current={f.id === selectedFindingId ? 'true' : undefined}
        >
          <FindingEntry
            finding={f}
            answerLabel="Contractor’s answer"
            where={
              <FindingTarget finding={f} markups={markups} fileNames={fileNames} checkLabels={checkLabels} />
            }
          />
        </button>
        {canChangeState && (
          <Button
            size="sm"
            variant="quiet"
            className="shrink-0"
            onClick={() => onSetState(f, f.state === 'closed' ? 'open' : 'closed')}
          >
            {f.state === 'closed' ? 'Reopen' : 'Close'}
          </Button>
        )}
      </div>
    </li>
  );

  return (
    <div className="flex flex-col">
      {editable && (
        <form
          aria-label="New finding"
          noValidate
          className="flex flex-col gap-1.5 border-b-2 border-rule-strong bg-sheet-alt px-3 py-2"
          onSubmit={(event) => {
            event.preventDefault();
            onSave();
          }}
        >
          <label htmlFor="finding-text" className="text-[13px] font-bold">
            New finding
          </label>
          <textarea
            id="finding-text"
            rows={3}
            value={draft.text}
            maxLength={4000}
            onChange={(event) => onDraftChange({ ...draft, text: event.target.value })}
            placeholder="What the contractor must answer or change"
            className="border border-rule-strong bg-sheet px-2 py-1 text-[13px]"
          />
          <fieldset className="flex flex-wrap items-center gap-x-3 gap-y-1 text-[12.5px]">
            <legend className="sr-only">Severity</legend>
            <span className="font-bold">Severity</span>
            {FINDING_SEVERITIES.map((s) => (
              <label key={s} className="inline-flex items-center gap-1">
                <input
                  type="radio"
                  name="finding-severity"
                  checked={draft.severity === s}
                  onChange={() => onDraftChange({ ...draft, severity: s })}
                />
                {SEVERITY_LABELS[s]}
              </label>
            ))}
          </fieldset>
          <div className="flex flex-wrap items-center gap-1.5 text-[12.5px]">
            <span className="font-bold">Tied to</span>
            {draftMarkup && (
              <LinkChip
                label={markupName(draftMarkup)}
                onRemove={() => onDraftChange({ ...draft, markupId: null })}
              >
                {markupName(draftMarkup)}
              </LinkChip>
            )}
            {!draftMarkup && draft.pageNumber && (
              <LinkChip
                label={`page ${draft.pageNumber}`}
                onRemove={() => onDraftChange({ ...draft, pageNumber: null, fileId: null })}
              >
                Page {draft.pageNumber}
              </LinkChip>
            )}
            {draft.checkId && (
              <LinkChip
                label={draft.checkLabel ?? draft.checkId}
                onRemove={() => onDraftChange({ ...draft, checkId: null, checkLabel: null })}
              >
                {draft.checkLabel ?? draft.checkId}
              </LinkChip>
            )}
            {!draftMarkup && !draft.pageNumber && !draft.checkId && (
              <span className="text-ink-soft">nothing yet</span>
            )}
            {selectedMarkup && selectedMarkup.id !== draft.markupId && (
              <Button
                size="sm"
                variant="quiet"
                onClick={() =>
                  onDraftChange({
                    ...draft,
                    markupId: selectedMarkup.id,
                    fileId: selectedMarkup.fileId,
                    pageNumber: selectedMarkup.pageNumber,
                  })
                }
              >
                Tie to {markupName(selectedMarkup)}
              </Button>
            )}
            {!selectedMarkup && currentFileId && draft.pageNumber !== currentPage && (
              <Button
                size="sm"
                variant="quiet"
                onClick={() =>
                  onDraftChange({ ...draft, markupId: null, fileId: currentFileId, pageNumber: currentPage })
                }
              >
                Tie to page {currentPage}
              </Button>
            )}
          </div>
          {saveError != null && (
            <p role="alert" className="text-[12.5px] font-bold text-fail-ink">
              {isApiError(saveError) ? saveError.message : 'The finding could not be saved.'}
            </p>
          )}
          <div className="flex items-center gap-2">
            <Button type="submit" size="sm" variant="primary" disabled={saving || tooShort}>
              {saving ? 'Saving…' : 'Add the finding'}
            </Button>
            <span className="text-[12px] text-ink-soft">Ctrl+S saves</span>
          </div>
        </form>
      )}
      {stateError != null && (
        <p role="alert" className="px-3 py-1.5 text-[12.5px] font-bold text-fail-ink">
          {isApiError(stateError) ? stateError.message : 'The finding could not be changed.'}
        </p>
      )}
      <section aria-labelledby="ws-findings-current">
        <h3
          id="ws-findings-current"
          className="border-b border-rule bg-sheet-alt px-3 py-1.5 text-[13px] font-bold"
        >
          Revision {currentRevision}{' '}
          <span className="font-normal text-ink-soft">
            · {current.length} {current.length === 1 ? 'finding' : 'findings'} · n / p to step through
          </span>
        </h3>
        {current.length === 0 ? (
          <p className="px-3 py-2 text-[13px] text-ink-soft">
            No findings on this revision yet.
            {editable && ' Write one above, or use “Raise a finding” on a check.'}
          </p>
        ) : (
          <ul>{current.map(item)}</ul>
        )}
      </section>
      {carried.length > 0 && (
        <section aria-labelledby="ws-findings-carried">
          <h3
            id="ws-findings-carried"
            className="border-y border-rule bg-sheet-alt px-3 py-1.5 text-[13px] font-bold"
          >
            Carried from earlier revisions{' '}
            <span className="font-normal text-ink-soft">
              · {carried.filter((f) => f.state !== 'closed').length} not closed
            </span>
          </h3>
          <ul>{carried.map(item)}</ul>
        </section>
      )}
    </div>
  );
}

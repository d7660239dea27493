// The finding being written: its text, severity and what it is tied to, and the save. A check's
// "Raise a finding" fills the draft; the severity chosen stays for the next finding. The
// unsaved draft is kept in the browser (src/lib/kept-draft.ts) across a reload or navigation.
import { useCreateFinding } from '@/lib/findings-client';
import { useKeptDraft } from '@/lib/kept-draft';
import { FINDING_SEVERITIES } from '@shared/schemas/reviews';
import type { RaiseFinding } from '../components/check-panel';
import { EMPTY_DRAFT, MIN_FINDING, type FindingDraft } from '../components/findings-panel';

/** A kept draft read back: only the shape the composer writes. */
function parseDraft(value: unknown): FindingDraft | null {
  if (!value || typeof value !== 'object') return null;
  const v = value as Record<string, unknown>;
  const text = (k: string) => (typeof v[k] === 'string' ? (v[k] as string) : null);
  if (typeof v.text !== 'string' || !(FINDING_SEVERITIES as readonly unknown[]).includes(v.severity))
    return null;
  return {
    text: v.text,
    severity: v.severity as FindingDraft['severity'],
    checkId: text('checkId'),
    checkLabel: text('checkLabel'),
    markupId: text('markupId'),
    fileId: text('fileId'),
    pageNumber: typeof v.pageNumber === 'number' ? v.pageNumber : null,
  };
}

const emptyDraft = (d: FindingDraft) => d.text.trim() === '' && !d.checkId && !d.markupId;

export function useFindingComposer(packageId: string, canMarkUp: boolean, draftKey: string) {
  const createFinding = useCreateFinding(packageId);
  const [draft, setDraft] = useKeptDraft<FindingDraft>(draftKey, EMPTY_DRAFT, parseDraft, emptyDraft);

  function save() {
    if (!canMarkUp || draft.text.trim().length < MIN_FINDING || createFinding.isPending) return;
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

  function raise(raise: RaiseFinding) {
    setDraft({ ...draft, checkId: raise.checkId, checkLabel: raise.label, text: draft.text || raise.text });
  }

  return {
    draft,
    setDraft,
    save,
    raise,
    saving: createFinding.isPending,
    error: createFinding.error,
  };
}

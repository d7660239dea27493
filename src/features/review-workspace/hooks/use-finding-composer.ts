// The finding being written: its text, severity and what it is tied to, and the save. A check's
// "Raise a finding" fills the draft; the severity chosen stays for the next finding.
import { useState } from 'react';
import { useCreateFinding } from '@/lib/findings-client';
import type { RaiseFinding } from '../components/check-panel';
import { EMPTY_DRAFT, MIN_FINDING, type FindingDraft } from '../components/findings-panel';

export function useFindingComposer(packageId: string, canMarkUp: boolean) {
  const createFinding = useCreateFinding(packageId);
  const [draft, setDraft] = useState<FindingDraft>(EMPTY_DRAFT);

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

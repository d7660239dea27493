// The markup tools' state (tool, colour, the picked markup, a text markup being typed) and
// the saves and removals that go with them.
import { useState } from 'react';
import type { Markup, MarkupBody, MarkupColour } from '@shared/schemas/reviews';
import { useCreateMarkup, useDeleteMarkup } from '../api/markups';
import { TEXT_SIZE, type PendingText } from '../components/markup-layer';
import type { Tool } from '../lib/tools';

export function useMarkupEditing(packageId: string, canMarkUp: boolean) {
  const createMarkup = useCreateMarkup(packageId);
  const deleteMarkup = useDeleteMarkup(packageId);
  const [tool, setTool] = useState<Tool>('select');
  const [colour, setColour] = useState<MarkupColour>('rust');
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [pending, setPending] = useState<PendingText | null>(null);

  function add(body: MarkupBody) {
    createMarkup.mutate(body, { onSuccess: (saved: Markup) => setSelectedId(saved.id) });
  }

  /** Saves the text markup being typed; false when there is none, so the caller can save something else. */
  function savePendingText(): boolean {
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
          setSelectedId(saved.id);
        },
      },
    );
    return true;
  }

  function removeSelected() {
    if (!canMarkUp || !selectedId) return;
    const id = selectedId;
    deleteMarkup.mutate(id, { onSuccess: () => setSelectedId((s) => (s === id ? null : s)) });
  }

  /** Let go of the pick and the text being typed (another file opened). */
  function clear() {
    setSelectedId(null);
    setPending(null);
  }

  return {
    tool,
    setTool,
    colour,
    setColour,
    selectedId,
    setSelectedId,
    pending,
    setPending,
    add,
    savePendingText,
    removeSelected,
    clear,
    /** Escape: no tool, no pick, no text being typed. */
    drop: () => {
      clear();
      setTool('select');
    },
    removing: deleteMarkup.isPending,
    error: createMarkup.error ?? deleteMarkup.error,
  };
}

export type MarkupEditing = ReturnType<typeof useMarkupEditing>;

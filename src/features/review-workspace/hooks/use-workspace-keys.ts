// The workspace's keyboard map, and the list of keys its "Keys" help shows, side by side so
// the two cannot drift. Keys typed into a field belong to the field, except Ctrl+S.
import { useEffect, useEffectEvent } from 'react';
import { TOOLS, type Tool } from '../lib/tools';

export type WorkspaceKeyActions = {
  save: () => void;
  nextPage: () => void;
  previousPage: () => void;
  nextFinding: () => void;
  previousFinding: () => void;
  /** Set only while a markup is picked, so Delete and Backspace are left alone otherwise. */
  removeSelected: (() => void) | null;
  drop: () => void;
  zoomIn: () => void;
  zoomOut: () => void;
  zoomActual: () => void;
  /** Set only for someone who may mark up. */
  pickTool: ((tool: Tool) => void) | null;
};

export const KEY_HELP: ReadonlyArray<readonly [keys: string, what: string]> = [
  ['PageDown ] / PageUp [', 'next / previous page'],
  ['n / p', 'next / previous finding'],
  ['Ctrl+S or s', 'save the text being written'],
  [`${TOOLS[0].key} – ${TOOLS[TOOLS.length - 1].key}`, 'markup tools'],
  ['Delete', 'remove the picked markup'],
  ['+ − 0', 'zoom in, out, 100%'],
  ['Esc', 'drop the tool and the pick'],
];

function isTyping(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null;
  if (!el || !el.tagName) return false;
  return el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName);
}

/** What a key press does, or null when the workspace leaves it alone. Exported for its test. */
export function keyAction(
  event: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'altKey' | 'target'>,
  actions: WorkspaceKeyActions,
): { run: () => void; preventDefault: boolean } | null {
  const mod = event.ctrlKey || event.metaKey;
  if (mod && event.key.toLowerCase() === 's') return { run: actions.save, preventDefault: true };
  if (mod || event.altKey || isTyping(event.target)) return null;
  switch (event.key) {
    case 'PageDown':
    case ']':
      return { run: actions.nextPage, preventDefault: true };
    case 'PageUp':
    case '[':
      return { run: actions.previousPage, preventDefault: true };
    case 'n':
      return { run: actions.nextFinding, preventDefault: false };
    case 'p':
      return { run: actions.previousFinding, preventDefault: false };
    case 's':
      return { run: actions.save, preventDefault: true };
    case 'Delete':
    case 'Backspace':
      return actions.removeSelected ? { run: actions.removeSelected, preventDefault: true } : null;
    case 'Escape':
      return { run: actions.drop, preventDefault: false };
    case '+':
    case '=':
      return { run: actions.zoomIn, preventDefault: false };
    case '-':
      return { run: actions.zoomOut, preventDefault: false };
    case '0':
      return { run: actions.zoomActual, preventDefault: false };
  }
  const tool = TOOLS.find((t) => t.key === event.key);
  const pick = actions.pickTool;
  return tool && pick ? { run: () => pick(tool.tool), preventDefault: false } : null;
}

/** Listens on the window for as long as the workspace is open; always calls the latest actions. */
export function useWorkspaceKeys(actions: WorkspaceKeyActions) {
  const onKey = useEffectEvent((event: KeyboardEvent) => {
    const action = keyAction(event, actions);
    if (!action) return;
    if (action.preventDefault) event.preventDefault();
    action.run();
  });

  useEffect(() => {
    const listener = (event: KeyboardEvent) => onKey(event);
    window.addEventListener('keydown', listener);
    return () => window.removeEventListener('keydown', listener);
  }, []);
}

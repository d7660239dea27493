// Rows that take the keyboard: one row at a time is in the Tab order (the active one);
// j/k or ↑/↓ move, Home/End jump, Enter opens, and where rows can be selected x ticks one.
import { useRef, useState, type KeyboardEvent, type RefObject } from 'react';

export function useRowKeys({
  count,
  onOpen,
  onToggle,
  anchorRef,
}: {
  count: number;
  onOpen: (index: number) => void;
  /** Absent where rows cannot be selected. */
  onToggle?: (index: number) => void;
  anchorRef: RefObject<number | null>;
}) {
  const [activeIndex, setActiveIndex] = useState(0);
  const rowRefs = useRef<(HTMLTableRowElement | null)[]>([]);
  const current = Math.min(activeIndex, Math.max(count - 1, 0));

  function moveTo(index: number) {
    const bounded = Math.max(0, Math.min(count - 1, index));
    setActiveIndex(bounded);
    rowRefs.current[bounded]?.focus();
  }

  function onKeyDown(event: KeyboardEvent<HTMLTableRowElement>, index: number) {
    if (event.altKey || event.ctrlKey || event.metaKey) return;
    // Keys typed into a control inside the row (the engineer picker) belong to that control.
    if (event.target !== event.currentTarget) return;
    switch (event.key) {
      case 'x':
        if (!onToggle) return;
        event.preventDefault();
        onToggle(index);
        anchorRef.current = index;
        break;
      case 'j':
      case 'ArrowDown':
        event.preventDefault();
        moveTo(index + 1);
        break;
      case 'k':
      case 'ArrowUp':
        event.preventDefault();
        moveTo(index - 1);
        break;
      case 'Home':
        event.preventDefault();
        moveTo(0);
        break;
      case 'End':
        event.preventDefault();
        moveTo(count - 1);
        break;
      case 'Enter':
        event.preventDefault();
        onOpen(index);
        break;
    }
  }

  /** Spread on each row: its ref, its place in the Tab order and its keys. */
  function rowProps(index: number) {
    return {
      ref: (element: HTMLTableRowElement | null) => {
        rowRefs.current[index] = element;
      },
      tabIndex: index === current ? 0 : -1,
      onFocus: () => setActiveIndex(index),
      onKeyDown: (event: KeyboardEvent<HTMLTableRowElement>) => onKeyDown(event, index),
    };
  }

  return { rowProps };
}

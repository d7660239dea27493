// Text someone is writing and has not saved yet, kept in this browser's localStorage so that a
// reload or a trip to another page does not lose it (the engineer's finding and the decision's
// conditions; the contractor's editor saves to the server instead). Keyed by person, package
// and revision; cleared when the text is saved, or emptied.
import { useEffect, useState } from 'react';

const PREFIX = 'counterpoise:draft:';

function read<T>(key: string, parse: (value: unknown) => T | null): T | null {
  try {
    const raw = window.localStorage.getItem(PREFIX + key);
    return raw === null ? null : parse(JSON.parse(raw));
  } catch {
    return null;
  }
}

/**
 * useState that survives a reload: the value starts from what was kept under `key` (if it
 * parses), and each change is kept; `isEmpty` values are not kept (the key is removed).
 */
export function useKeptDraft<T>(
  key: string,
  initial: T,
  parse: (value: unknown) => T | null,
  isEmpty: (value: T) => boolean,
) {
  const [value, setValue] = useState<T>(() => read(key, parse) ?? initial);
  useEffect(() => {
    try {
      if (isEmpty(value)) window.localStorage.removeItem(PREFIX + key);
      else window.localStorage.setItem(PREFIX + key, JSON.stringify(value));
    } catch {
      // A full or disabled storage only loses the safety net, not the text on screen.
    }
  }, [key, value, isEmpty]);
  return [value, setValue] as const;
}

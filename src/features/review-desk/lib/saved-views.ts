// Saved queue views: a name and the filter part of the URL (never rows or other server
// data), kept in this browser's localStorage per person and per list page.
import { NARROWING_KEYS } from './view-keys';

export type SavedView = { name: string; search: string };

const PREFIX = 'counterpoise:saved-views';
export const MAX_VIEWS = 20;

export function storageKey(userId: string, scope: string): string {
  return `${PREFIX}:${userId}:${scope}`;
}

/** The part of a list URL a view keeps: filters and sort, in a fixed order, without the page. */
export function viewSearch(params: URLSearchParams): string {
  const kept = new URLSearchParams();
  for (const key of NARROWING_KEYS) {
    const value = params.get(key);
    if (value !== null && value !== '') kept.set(key, value);
  }
  return kept.toString();
}

export function readViews(key: string): SavedView[] {
  try {
    const parsed: unknown = JSON.parse(window.localStorage.getItem(key) ?? '[]');
    if (!Array.isArray(parsed)) return [];
    return parsed
      .filter(
        (v): v is SavedView =>
          typeof v === 'object' &&
          v !== null &&
          typeof (v as SavedView).name === 'string' &&
          typeof (v as SavedView).search === 'string',
      )
      .slice(0, MAX_VIEWS);
  } catch {
    // Unreadable storage (private mode, hand-edited value): start with no views.
    return [];
  }
}

export function writeViews(key: string, views: SavedView[]): boolean {
  try {
    window.localStorage.setItem(key, JSON.stringify(views.slice(0, MAX_VIEWS)));
    return true;
  } catch {
    return false;
  }
}

/** Adds a view, replacing one of the same name (names compare without case). */
export function withView(views: SavedView[], view: SavedView): SavedView[] {
  const others = views.filter((v) => v.name.toLowerCase() !== view.name.toLowerCase());
  return [...others, view].sort((a, b) => a.name.localeCompare(b.name));
}

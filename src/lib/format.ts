// Dates as the trade writes them on paper ("14 Mar 2027") and the urgency beside them.
// Planned lift dates are calendar dates (no time of day), so they are compared as dates
// in UTC, never shifted by the browser's time zone. Month names come from shared/vocabulary.
import { MONTHS, tradeDateOf } from '@shared/vocabulary/dates';

const DAY_MS = 86_400_000;

/** Midnight UTC of a YYYY-MM-DD string (or the date part of an ISO timestamp). */
function calendarDay(value: string): number | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})/.exec(value);
  if (!match) return null;
  return Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
}

function todayUtc(now: Date): number {
  return Date.UTC(now.getFullYear(), now.getMonth(), now.getDate());
}

export function formatDate(value: string | null | undefined): string {
  if (!value) return '—';
  const day = calendarDay(value);
  if (day === null) return value;
  const date = new Date(day);
  return tradeDateOf(date.getUTCFullYear(), date.getUTCMonth() + 1, date.getUTCDate());
}

/** A timestamp shown in the reader's local time, e.g. "14 Mar 2027, 09:05". */
export function formatDateTime(value: string | null | undefined): string {
  if (!value) return '—';
  const date = new Date(value);
  if (Number.isNaN(date.getTime())) return value;
  const hh = String(date.getHours()).padStart(2, '0');
  const mm = String(date.getMinutes()).padStart(2, '0');
  return `${date.getDate()} ${MONTHS[date.getMonth()]} ${date.getFullYear()}, ${hh}:${mm}`;
}

export type Urgency = { text: string; tone: 'late' | 'soon' | 'later' | 'past' };

/**
 * How near a planned lift date is. `settled` packages (already returned) are no longer
 * late: their past dates read as plain history.
 */
export function liftUrgency(
  value: string | null | undefined,
  settled: boolean,
  now = new Date(),
): Urgency | null {
  if (!value) return null;
  const day = calendarDay(value);
  if (day === null) return null;
  const days = Math.round((day - todayUtc(now)) / DAY_MS);
  if (days === 0) return { text: 'today', tone: settled ? 'past' : 'soon' };
  if (days > 0) {
    const text = days === 1 ? 'tomorrow' : `in ${days} days`;
    return { text, tone: settled || days > 3 ? 'later' : 'soon' };
  }
  const ago = -days;
  if (settled) return { text: ago === 1 ? 'yesterday' : `${ago} days ago`, tone: 'past' };
  return { text: ago === 1 ? '1 day late' : `${ago} days late`, tone: 'late' };
}

export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count.toLocaleString('en-GB')} ${count === 1 ? one : many}`;
}

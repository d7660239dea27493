// Dates as the trade writes them on paper ("14 Mar 2027"), declared once for the screens, the
// stamped return and the calculation sheet. Pure: the instant is always passed in.
export const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "14 Mar 2027" from a year, a month (1–12) and a day. */
export function tradeDateOf(year: number, month: number, day: number): string {
  return `${day} ${MONTHS[month - 1]} ${year}`;
}

function zoned(iso: string, timeZone: string): Record<string, string> | null {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return null;
  let fmt: Intl.DateTimeFormat;
  try {
    fmt = new Intl.DateTimeFormat('en-US', {
      timeZone,
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
    });
  } catch {
    return zoned(iso, 'UTC');
  }
  return Object.fromEntries(fmt.formatToParts(d).map((p) => [p.type, p.value]));
}

/** "14 Mar 2027" in the site's time zone (UTC when the zone is unknown). */
export function tradeDate(iso: string, timeZone: string): string {
  const p = zoned(iso, timeZone);
  if (!p) return '—';
  return tradeDateOf(Number(p.year), Number(p.month), Number(p.day));
}

/** "14 Mar 2027 16:05" in the site's time zone. */
export function tradeDateTime(iso: string, timeZone: string): string {
  const p = zoned(iso, timeZone);
  if (!p) return '—';
  return `${tradeDate(iso, timeZone)} ${p.hour}:${p.minute}`;
}

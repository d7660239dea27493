// When a package's review is due: the site's turnaround in working days from the day it was
// submitted, or the planned lift date less the site's margin, whichever comes first. Working
// days are Monday to Friday; the desk knows no public holidays, so a coordinator who works
// through one sets the turnaround accordingly. Dates are calendar dates (YYYY-MM-DD), read in
// UTC. Pure: the server stores the result at submission, the client shows it.

const DAY_MS = 86_400_000;

function toDate(iso: string): Date {
  return new Date(`${iso}T00:00:00Z`);
}

function toIso(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/** `days` working days (Monday–Friday) after `from`; a start on a weekend counts from Monday. */
export function addWorkingDays(from: string, days: number): string {
  let d = toDate(from);
  let left = days;
  while (left > 0) {
    d = new Date(d.getTime() + DAY_MS);
    const weekday = d.getUTCDay();
    if (weekday !== 0 && weekday !== 6) left -= 1;
  }
  return toIso(d);
}

export interface ReviewTimes {
  /** Working days the site gives a review. */
  turnaroundDays: number;
  /** Calendar days before the planned lift by which the review must be done. */
  marginDays: number;
}

/** The review's due date for a revision submitted on `submittedOn` (YYYY-MM-DD). */
export function reviewDueOn(submittedOn: string, plannedLiftDate: string | null, times: ReviewTimes): string {
  const byTurnaround = addWorkingDays(submittedOn, times.turnaroundDays);
  if (!plannedLiftDate) return byTurnaround;
  const byLift = toIso(new Date(toDate(plannedLiftDate).getTime() - times.marginDays * DAY_MS));
  return byLift < byTurnaround ? byLift : byTurnaround;
}

/** Statuses in which the review is still owed, so a past due date is overdue. */
export const REVIEW_OWED = ['checking', 'check_failed', 'ready_for_review', 'with_engineer'] as const;

export function isReviewOverdue(dueOn: string | null, status: string, today: string): boolean {
  return dueOn !== null && (REVIEW_OWED as readonly string[]).includes(status) && dueOn < today;
}

export const REVIEW_TIMES_DEFAULT: ReviewTimes = { turnaroundDays: 5, marginDays: 2 };

// Review due dates: working days Monday to Friday counted from the day of submission, or the
// planned lift less the margin when that is sooner; overdue only while the review is owed.
// Worked by hand against the 2026 calendar (4 Dec 2026 is a Friday).
import { describe, expect, it } from 'vitest';
import { addWorkingDays, isReviewOverdue, reviewDueOn } from '@shared/rules/review-due';

describe('review due dates', () => {
  it('when working days are added, then weekends are passed over', () => {
    expect(addWorkingDays('2026-12-04', 1)).toBe('2026-12-07'); // Friday → Monday
    expect(addWorkingDays('2026-12-04', 5)).toBe('2026-12-11'); // Friday → next Friday
    expect(addWorkingDays('2026-12-05', 1)).toBe('2026-12-07'); // Saturday → Monday
    expect(addWorkingDays('2026-12-07', 3)).toBe('2026-12-10'); // Monday → Thursday
    expect(addWorkingDays('2026-12-28', 5)).toBe('2027-01-04'); // across the year end
  });

  it('when the lift less the margin comes first, then it is the due date; otherwise the turnaround', () => {
    const times = { turnaroundDays: 5, marginDays: 2 };
    expect(reviewDueOn('2026-12-04', '2026-12-09', times)).toBe('2026-12-07');
    expect(reviewDueOn('2026-12-04', '2026-12-31', times)).toBe('2026-12-11');
    expect(reviewDueOn('2026-12-04', null, times)).toBe('2026-12-11');
    // A lift already inside the margin: due at once (a past date, shown overdue).
    expect(reviewDueOn('2026-12-04', '2026-12-05', times)).toBe('2026-12-03');
  });

  it('when the due date has passed, then the package is overdue only while its review is owed', () => {
    expect(isReviewOverdue('2026-12-03', 'with_engineer', '2026-12-04')).toBe(true);
    expect(isReviewOverdue('2026-12-03', 'ready_for_review', '2026-12-04')).toBe(true);
    expect(isReviewOverdue('2026-12-04', 'with_engineer', '2026-12-04')).toBe(false);
    expect(isReviewOverdue('2026-12-03', 'decided', '2026-12-04')).toBe(false);
    expect(isReviewOverdue('2026-12-03', 'returned', '2026-12-04')).toBe(false);
    expect(isReviewOverdue(null, 'with_engineer', '2026-12-04')).toBe(false);
  });
});

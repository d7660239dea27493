import { describe, expect, it } from 'vitest';
import { formatDate, liftUrgency } from '@/lib/format';
import { toQueryString } from '@/lib/api-client';
import { safeNextPath } from '@/lib/auth';

const now = new Date(2027, 2, 11, 16, 30); // 11 Mar 2027, late afternoon local time

describe('dates and urgency', () => {
  it('when a calendar date is formatted, then it reads as the trade writes it', () => {
    expect(formatDate('2027-03-14')).toBe('14 Mar 2027');
    expect(formatDate('2027-12-01T23:30:00.000Z')).toBe('1 Dec 2027');
    expect(formatDate(null)).toBe('—');
  });

  it('when a lift is ahead, near or past, then the urgency says how far and marks the near and late ones', () => {
    expect(liftUrgency('2027-03-14', false, now)).toEqual({ text: 'in 3 days', tone: 'soon' });
    expect(liftUrgency('2027-03-12', false, now)).toEqual({ text: 'tomorrow', tone: 'soon' });
    expect(liftUrgency('2027-03-11', false, now)).toEqual({ text: 'today', tone: 'soon' });
    expect(liftUrgency('2027-03-25', false, now)).toEqual({ text: 'in 14 days', tone: 'later' });
    expect(liftUrgency('2027-03-09', false, now)).toEqual({ text: '2 days late', tone: 'late' });
  });

  it('when a returned package has a past date, then it reads as history, not as late', () => {
    expect(liftUrgency('2027-03-09', true, now)).toEqual({ text: '2 days ago', tone: 'past' });
  });
});

describe('links and query strings', () => {
  it('when a next path points off the site, then it is refused', () => {
    expect(safeNextPath('/queue?status=decided')).toBe('/queue?status=decided');
    expect(safeNextPath('//evil.example/queue')).toBeNull();
    expect(safeNextPath('https://evil.example')).toBeNull();
    expect(safeNextPath('/\\evil.example')).toBeNull();
    expect(safeNextPath('/sign-in?next=/queue')).toBeNull();
    // Tab, newline and encoded variants of "//" (the security review's cases).
    expect(safeNextPath('/\t/evil.example')).toBeNull();
    expect(safeNextPath('/\n/evil.example')).toBeNull();
    expect(safeNextPath('/\r\n/evil.example')).toBeNull();
    expect(safeNextPath('/%2F/evil.example')).toBeNull();
    expect(safeNextPath('/%5Cevil.example')).toBeNull();
    expect(safeNextPath('/%09/evil.example')).toBeNull();
    expect(safeNextPath('/%E0%A4%A')).toBeNull();
    expect(safeNextPath('/packages/abc#files')).toBe('/packages/abc#files');
  });

  it('when a query has empty values, then they are left out and the order is kept', () => {
    expect(toQueryString({ status: undefined, q: '', sort: 'plannedLiftDate', page: 2, pageSize: 25 })).toBe(
      '?sort=plannedLiftDate&page=2&pageSize=25',
    );
    expect(toQueryString({})).toBe('');
  });
});

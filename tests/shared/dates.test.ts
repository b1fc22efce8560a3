// shared/dates: calendar arithmetic in UTC and one style of date for people. The weekdays and
// month lengths are those of the Gregorian calendar (ISO 8601 weeks start on Monday).
import { describe, expect, it } from 'vitest';
import { addDaysIso, formatDate, formatDateTime, localTodayIso, mondayOf, todayIso } from '../../shared/dates';

describe('calendar dates (ISO, UTC)', () => {
  it('adds days across month, year and leap-year ends', () => {
    expect(addDaysIso('2027-01-20', 14)).toBe('2027-02-03');
    expect(addDaysIso('2028-02-28', 1)).toBe('2028-02-29'); // 2028 is a leap year
    expect(addDaysIso('2027-02-28', 1)).toBe('2027-03-01');
    expect(addDaysIso('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDaysIso('2027-01-01', -1)).toBe('2026-12-31');
  });

  it('finds the Monday of a week; a Sunday belongs to the week that began six days before', () => {
    expect(mondayOf('2026-12-02')).toBe('2026-11-30'); // a Wednesday
    expect(mondayOf('2026-11-30')).toBe('2026-11-30');
    expect(mondayOf('2026-12-06')).toBe('2026-11-30'); // a Sunday
    expect(mondayOf('2027-01-01')).toBe('2026-12-28'); // across the year end
  });

  it("gives today in UTC for data and the local day for a viewer's list", () => {
    expect(todayIso(new Date('2026-12-02T23:30:00Z'))).toBe('2026-12-02');
    const local = new Date(2026, 11, 2, 0, 5); // 00:05 local time on 2 Dec 2026
    expect(localTodayIso(local)).toBe('2026-12-02');
  });
});

describe('dates for people: one style, "2 Dec 2026"', () => {
  it('writes day, short month and year, the same for a date and a timestamp', () => {
    expect(formatDate('2026-12-02')).toBe('2 Dec 2026');
    expect(formatDate('2026-12-02T23:59:00Z')).toBe('2 Dec 2026');
    expect(formatDate(new Date('2027-01-20T08:00:00Z'))).toBe('20 Jan 2027');
  });

  it('adds the weekday or leaves out the year on request', () => {
    expect(formatDate('2026-12-02', { weekday: true })).toBe('Wed, 2 Dec 2026');
    expect(formatDate('2026-12-02', { weekday: true, year: false })).toBe('Wed 2 Dec');
  });

  it('writes a moment with the time in the zone asked for', () => {
    expect(formatDateTime('2026-12-02T14:05:00Z', 'UTC')).toBe('2 Dec 2026, 14:05');
    expect(formatDateTime('2026-07-02T14:05:00Z', 'Europe/London')).toBe('2 Jul 2026, 15:05'); // British Summer Time
  });

  it('gives nothing for nothing and returns what it cannot read', () => {
    expect(formatDate(null)).toBe('');
    expect(formatDate('')).toBe('');
    expect(formatDate('soon')).toBe('soon');
    expect(formatDateTime(undefined)).toBe('');
  });
});

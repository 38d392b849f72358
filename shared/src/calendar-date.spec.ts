import { showDate } from './calendar-date';

// The long form the screens and printouts share: day, short month name, year ("3 Dec 2026").
describe('showDate', () => {
  it('shows a YYYY-MM-DD date as day, short month and year without a leading zero', () => {
    expect(showDate('2026-12-03')).toBe('3 Dec 2026');
    expect(showDate('2027-01-31')).toBe('31 Jan 2027');
  });

  it('keeps the calendar day of a timestamp whatever the time zone (the date part is read as text)', () => {
    expect(showDate('2026-12-31T23:30:00-11:00')).toBe('31 Dec 2026');
    expect(showDate('2026-01-01T00:15:00+14:00')).toBe('1 Jan 2026');
  });

  it('shows nothing for no date and leaves text that is not a date as it is', () => {
    expect(showDate(null)).toBe('');
    expect(showDate(undefined)).toBe('');
    expect(showDate('')).toBe('');
    expect(showDate('2026-13-01')).toBe('2026-13-01');
    expect(showDate('soon')).toBe('soon');
  });
});

// A date without a time (a deadline, a day worked), held as YYYY-MM-DD text
// end to end: the years it may fall in, and its one long form on every screen
// and printout, "3 Dec 2026", worked from the text itself so no time zone can
// move it to another day.

/** The years a date without a time may fall in (PostgreSQL has no year 0, and a deadline is not ten centuries off). */
export const DATE_YEARS = { min: 1900, max: 2999 } as const;

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;

/** "2026-12-03" (or a timestamp starting so) shown as "3 Dec 2026"; empty for none, the text as it is when it is not a date. */
export function showDate(isoDate: string | null | undefined): string {
  if (!isoDate) return '';
  const match = /^(\d{4})-(\d{2})-(\d{2})/.exec(isoDate);
  const month = match ? MONTHS[Number(match[2]) - 1] : undefined;
  if (!match || !month) return isoDate;
  return `${Number(match[3])} ${month} ${match[1]}`;
}

// The one long form of a date without a time, the same on every screen and
// printout: "3 Dec 2026". Worked from the YYYY-MM-DD text itself, so no time
// zone can move it to another day.

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;

/** "2026-12-03" (or a timestamp starting so) shown as "3 Dec 2026"; empty for none, the text as it is when it is not a date. */
export function showDate(isoDate: string | null | undefined): string {
  if (!isoDate) return '';
  const match = /^(\d{4})-(\d{2})-(\d{2})/.exec(isoDate);
  const month = match ? MONTHS[Number(match[2]) - 1] : undefined;
  if (!match || !month) return isoDate;
  return `${Number(match[3])} ${month} ${match[1]}`;
}

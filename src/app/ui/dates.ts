/** Dates and times as the app shows them, from the ISO strings the API sends. */

/** "2026-12-24" shown as "24 Dec 2026": the one long form the printouts use too, from the domain package. */
export { showDate } from '@keepstitch/shared';

/** Today's date in the browser's own calendar, as YYYY-MM-DD. */
export function todayIso(): string {
  const now = new Date();
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** "Sent 3 Jun 2026, 14:05" style date and time from an ISO timestamp, in the browser's time zone. */
export function showDateTime(iso: string | null | undefined): string {
  if (!iso) return '';
  return new Date(iso).toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
}

/**
 * Calendar days as 'YYYY-MM-DD' strings, in the studio's calendar (UTC), so a
 * deadline or a validity date never moves by a day with the time zone.
 */
const DAY_MS = 86_400_000;

export function today(): string {
  return new Date().toISOString().slice(0, 10);
}

export function addDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
}

export function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS);
}

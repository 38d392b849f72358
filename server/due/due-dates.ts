import { addDays } from '../core/calendar';

/** The last day (Sunday) of the week holding `day`, weeks starting on Monday (the UK's custom, ISO 8601). */
export function endOfWeek(day: string): string {
  const weekday = new Date(`${day}T00:00:00Z`).getUTCDay(); // 0 = Sunday
  return addDays(day, (7 - weekday) % 7);
}

export type DueWeek = 'overdue' | 'this' | 'next';

/** Which part of the overview a deadline falls in, counted from today. */
export function weekOf(deadline: string, today: string): DueWeek {
  if (deadline < today) return 'overdue';
  return deadline <= endOfWeek(today) ? 'this' : 'next';
}


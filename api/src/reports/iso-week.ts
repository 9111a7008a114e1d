import { addDays, isoWeekday } from '../bench/calendar-days';

/** The Monday of the ISO 8601 week a day is in (ISO weeks run Monday to Sunday). */
export const mondayOf = (day: string) => addDays(day, 1 - isoWeekday(day));

/**
 * The ISO 8601 week of a day, e.g. 2026-W49: the week belongs to the year of its Thursday, and
 * week 1 is the week with the year's first Thursday in it (ISO 8601-1:2019 §5.2.4.1).
 */
export function isoWeekLabel(day: string): string {
  const thursday = addDays(mondayOf(day), 3);
  const year = Number(thursday.slice(0, 4));
  const dayOfYear = Math.round((Date.parse(`${thursday}T00:00:00Z`) - Date.UTC(year, 0, 1)) / 86_400_000);
  return `${year}-W${String(Math.floor(dayOfYear / 7) + 1).padStart(2, '0')}`;
}

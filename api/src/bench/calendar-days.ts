/**
 * Calendar-day arithmetic on 'YYYY-MM-DD' strings. A bench day is a day on the shop's wall
 * calendar, not an instant, so everything here runs on UTC midnights and never sees a time zone.
 */
const DAY_MS = 86_400_000;
export { isCalendarDay } from '@loomwright/shared';

export function addDays(day: string, days: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
}

export function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS);
}

/** ISO weekday: 1 = Monday … 7 = Sunday (ISO 8601). */
export function isoWeekday(day: string): 1 | 2 | 3 | 4 | 5 | 6 | 7 {
  const js = new Date(`${day}T00:00:00Z`).getUTCDay();
  return (js === 0 ? 7 : js) as 1 | 2 | 3 | 4 | 5 | 6 | 7;
}

export function eachDay(from: string, to: string): string[] {
  const out: string[] = [];
  for (let d = from; d <= to; d = addDays(d, 1)) out.push(d);
  return out;
}

// One formatter per time zone: building an Intl.DateTimeFormat costs far more than formatting with
// one, and every bench read asks for today.
const dayFormats = new Map<string, Intl.DateTimeFormat>();

/** Today's calendar day in the shop's time zone (the shop's wall clock decides what "today" is). */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  let format = dayFormats.get(timeZone);
  if (!format) {
    // en-CA formats as YYYY-MM-DD. An unknown zone throws here, before anything is kept.
    format = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
    dayFormats.set(timeZone, format);
  }
  return format.format(now);
}

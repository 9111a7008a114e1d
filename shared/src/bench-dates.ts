/** Whole days from one calendar day ('YYYY-MM-DD') to another; negative when `to` is before `from`. */
export function calendarDaysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

/**
 * How a new bench date relates to the old (or to the suggested) one, in words: "3 days later",
 * "1 day earlier", "the same day". A later date is a later start; an earlier date an earlier one.
 */
export function dateShiftWords(from: string, to: string): string {
  const days = calendarDaysBetween(from, to);
  if (days === 0) return 'the same day';
  const n = Math.abs(days);
  return `${n} ${n === 1 ? 'day' : 'days'} ${days > 0 ? 'later' : 'earlier'}`;
}

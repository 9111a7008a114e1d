import { currentShopFormat } from '@loomwright/shared/ui';

/**
 * Money, hours, dates and moments as the shop writes them, in its own locale, currency and time
 * zone: every helper here is the one shared formatter (`shopFormat` in @loomwright/shared), bound
 * to the shop's settings by `ShopVoice` (src/app/shop-voice.tsx). Amounts stay decimal strings.
 */
export function formatMoney(amount: string | null | undefined, currency?: string): string {
  return currentShopFormat().money(amount, currency);
}

export function formatMoneyRange(low: string, high: string, currency?: string): string {
  return currentShopFormat().moneyRange(low, high, currency);
}

/** A rate: "$125.00/hr". */
export function formatRate(amount: string | null | undefined, currency?: string): string {
  return currentShopFormat().perHour(amount, currency);
}

/** A count in the shop's numbers: "1,234.5". */
export function formatQuantity(value: string | number): string {
  return currentShopFormat().quantity(value);
}

/** Hours of bench work: "7 hr", "1.5 hr". */
export function formatHours(hours: string | number | null | undefined): string {
  return currentShopFormat().hours(hours);
}

/** A calendar date (YYYY-MM-DD, no time zone) to a Date at noon UTC, so no zone can shift its day. */
export function parseDay(day: string): Date {
  const [y, m, d] = day.slice(0, 10).split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d, 12));
}

export function toDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}

export function addDays(day: string, days: number): string {
  const date = parseDay(day);
  date.setUTCDate(date.getUTCDate() + days);
  return toDay(date);
}

/** ISO weekday, 1 = Monday … 7 = Sunday. */
export function isoWeekday(day: string): number {
  const w = parseDay(day).getUTCDay();
  return w === 0 ? 7 : w;
}

export function startOfWeek(day: string): string {
  return addDays(day, 1 - isoWeekday(day));
}

export function startOfMonth(day: string): string {
  return `${day.slice(0, 7)}-01`;
}

export function endOfMonth(day: string): string {
  const date = parseDay(startOfMonth(day));
  date.setUTCMonth(date.getUTCMonth() + 1, 0);
  return toDay(date);
}

/** Today in the shop's own calendar (its time zone), as YYYY-MM-DD. */
export function today(): string {
  return currentShopFormat().today();
}

/** "Tue, Jan 12"; with the year when it is not this year. */
export function formatDay(day: string | null | undefined): string {
  return currentShopFormat().day(day);
}

/** "Tue, Jan 12, 2027", always with the year. */
export function formatDayWithYear(day: string | null | undefined): string {
  return currentShopFormat().day(day, { year: 'always' });
}

export function formatMonth(day: string): string {
  return currentShopFormat().month(day);
}

/** A moment (ISO timestamp) in the shop's time zone, with the zone: "Tue, Dec 8, 2026, 5:45 PM CST". */
export function formatStamp(iso: string | null | undefined): string {
  return currentShopFormat().dateTime(iso);
}

import { currentShopFormat } from '@loomwright/shared/ui';

/**
 * Money, hours, days and moments as the player reads them, in the shop's locale, currency and time
 * zone: each helper is the one shared formatter (`shopFormat` in @loomwright/shared), bound to the
 * shop's settings by `ShopVoice` (src/app/shop-voice.tsx). The backoffice, the e-mails, calendar
 * files and PDFs use the same formatter, so "$1,120.00" or "Tue, Jan 12, 2027" reads the same everywhere.
 */
export function formatMoney(amount: string | null | undefined, currency?: string): string {
  return currentShopFormat().money(amount, currency);
}

/** "$1,120.00 – $1,400.00", or one figure when both ends agree. */
export function formatMoneyRange(low: string, high: string, currency?: string): string {
  return currentShopFormat().moneyRange(low, high, currency);
}

/** A level's rates: "$100.00 – $150.00/hr". */
export function formatRateRange(low: string, high: string, currency?: string): string {
  return currentShopFormat().perHourRange(low, high, currency);
}

/** A count or measure in the shop's numbers: "1,234.5", "12 ft". */
export function formatQuantity(value: string | number, unit?: 'foot' | 'millimeter' | 'percent', maximumFractionDigits = 2): string {
  return currentShopFormat().quantity(value, unit, maximumFractionDigits);
}

/** "14 hr", "13.5 hr". */
export function formatHours(hours: string | number | null | undefined): string {
  return currentShopFormat().hours(hours);
}

/** A calendar day (a bench date), always with the year: "Tue, Jan 12, 2027". */
export function formatDay(day: string | null | undefined): string {
  return currentShopFormat().day(day, { year: 'always' });
}

/** A moment in the shop's time zone, with the zone: "Tue, Dec 8, 2026, 5:45 PM CST". */
export function formatMoment(iso: string | null | undefined): string {
  return currentShopFormat().dateTime(iso);
}

/** The shop's today, 'YYYY-MM-DD'. */
export function shopToday(): string {
  return currentShopFormat().today();
}

export const formatAmount = formatMoney;
export const formatRange = formatMoneyRange;

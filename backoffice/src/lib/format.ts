import Decimal from 'decimal.js';

/**
 * Money and dates as the shop reads them: "$1,120.00", "Tue 12 Jan". Amounts arrive as decimal
 * strings and stay decimals (decimal.js) until they are text; they never pass through a float.
 */
export function formatMoney(amount: string | null | undefined, currency = 'USD'): string {
  if (amount === null || amount === undefined || amount === '') return '—';
  let value: Decimal;
  try {
    value = new Decimal(amount);
  } catch {
    return amount;
  }
  const fixed = value.abs().toFixed(2);
  const [whole, cents] = fixed.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return `${value.isNegative() ? '−' : ''}${currencySymbol(currency)}${grouped}.${cents}`;
}

const symbols = new Map<string, string>();
function currencySymbol(currency: string): string {
  const known = symbols.get(currency);
  if (known) return known;
  const part = new Intl.NumberFormat('en-US', { style: 'currency', currency, currencyDisplay: 'narrowSymbol' })
    .formatToParts(0)
    .find((p) => p.type === 'currency');
  const symbol = part?.value ?? `${currency} `;
  symbols.set(currency, symbol);
  return symbol;
}

export function formatMoneyRange(low: string, high: string, currency = 'USD'): string {
  if (new Decimal(low).eq(high)) return formatMoney(low, currency);
  return `${formatMoney(low, currency)}–${formatMoney(high, currency)}`;
}

/** Hours as the bench says them: "7 h", "1.5 h". */
export function formatHours(hours: string | number | null | undefined): string {
  if (hours === null || hours === undefined || hours === '') return '—';
  return `${new Decimal(hours).toDecimalPlaces(2).toString()} h`;
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

/** Today in the browser's own calendar, as YYYY-MM-DD. */
export function today(): string {
  const now = new Date();
  return toDay(new Date(Date.UTC(now.getFullYear(), now.getMonth(), now.getDate(), 12)));
}

const dayFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
const dayYearFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC',
});
const monthFormat = new Intl.DateTimeFormat('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' });
const stampFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit',
});

/** "Tue 12 Jan"; with the year when it is not this year. */
export function formatDay(day: string | null | undefined): string {
  if (!day) return '—';
  const sameYear = day.slice(0, 4) === today().slice(0, 4);
  return (sameYear ? dayFormat : dayYearFormat).format(parseDay(day)).replace(',', '');
}

export function formatMonth(day: string): string {
  return monthFormat.format(parseDay(day));
}

/** A moment (ISO timestamp) in the reader's own time: "3 Dec 2026, 14:05". */
export function formatStamp(iso: string | null | undefined): string {
  if (!iso) return '—';
  return stampFormat.format(new Date(iso));
}

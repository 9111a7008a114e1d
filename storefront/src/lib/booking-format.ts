import Decimal from 'decimal.js';

/** "$1,120.00" from a decimal string; money never passes through a float on its way to the page. */
export function formatAmount(amount: string | null | undefined, currency: string): string {
  if (amount === null || amount === undefined || currency.length !== 3) return '—';
  const format = new Intl.NumberFormat('en-US', { style: 'currency', currency });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  // formatToParts on the rounded string keeps the exact digits (Intl takes strings since ES2023).
  return format.format(new Decimal(amount).toFixed(digits) as unknown as number);
}

export const formatRange = (low: string, high: string, currency: string) =>
  low === high ? formatAmount(low, currency) : `${formatAmount(low, currency)}–${formatAmount(high, currency)}`;

/** "Tue 12 Jan 2027" from a calendar day 'YYYY-MM-DD' (no time zone shifts a bench day). */
export function formatDay(day: string | null | undefined): string {
  if (!day) return '—';
  const [y, m, d] = day.split('-').map(Number);
  // Parts joined by spaces: engines differ on the comma after the weekday, e-mail has none.
  return new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' })
    .formatToParts(new Date(Date.UTC(y, m - 1, d)))
    .filter((part) => part.type !== 'literal')
    .map((part) => part.value)
    .join(' ');
}

/** "Tue 12 Jan 2027, 14:05" in the player's own time zone. */
export const formatMoment = (iso: string) =>
  new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }).format(new Date(iso));

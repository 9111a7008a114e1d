/**
 * Money and hours as the player reads them: "$1,120", "$1,120–$1,400", "14 h".
 * Amounts arrive as decimal strings; Intl.NumberFormat formats a numeric string exactly
 * (ECMA-402 NumberFormat v3), so no float ever touches a price.
 */
const formatters = new Map<string, Intl.NumberFormat>();

function formatter(currency: string, cents: boolean): Intl.NumberFormat {
  const key = `${currency}:${cents}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.NumberFormat('en-US', {
      style: 'currency',
      currency,
      minimumFractionDigits: cents ? 2 : 0,
      maximumFractionDigits: cents ? 2 : 0,
    });
    formatters.set(key, f);
  }
  return f;
}

const hasCents = (amount: string) => /\.\d*[1-9]/.test(amount);

export function formatMoney(amount: string, currency: string): string {
  return formatter(currency, hasCents(amount)).format(amount as unknown as number);
}

/** "$1,120–$1,400", or one figure when both ends agree. */
export function formatMoneyRange(low: string, high: string, currency: string): string {
  const cents = hasCents(low) || hasCents(high);
  const a = formatter(currency, cents).format(low as unknown as number);
  const b = formatter(currency, cents).format(high as unknown as number);
  return a === b ? a : `${a}–${b}`;
}

/** "14 h", "13.5 h". */
export function formatHours(hours: string): string {
  const trimmed = hours.includes('.') ? hours.replace(/0+$/, '').replace(/\.$/, '') : hours;
  return `${trimmed} h`;
}

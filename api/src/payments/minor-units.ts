import Decimal from 'decimal.js';

/**
 * Decimal places of a currency's minor unit, from ISO 4217 as the runtime's ICU data carries it
 * (USD and EUR 2, JPY 0, BHD 3).
 */
export function minorUnitDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency: currency.trim().toUpperCase() }).resolvedOptions()
    .maximumFractionDigits ?? 2;
}

/** "350.00" USD → 35000: the integer the payment provider takes. Rounds half up at the minor unit. */
export function toMinorUnits(amount: string, currency: string): number {
  const digits = minorUnitDigits(currency);
  return new Decimal(amount).toDecimalPlaces(digits, Decimal.ROUND_HALF_UP).times(new Decimal(10).pow(digits)).toNumber();
}

export function fromMinorUnits(minor: number | string, currency: string): string {
  const digits = minorUnitDigits(currency);
  return new Decimal(minor).dividedBy(new Decimal(10).pow(digits)).toFixed(Math.max(digits, 2));
}

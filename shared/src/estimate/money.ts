import { code as currencyByCode } from 'currency-codes';
import Decimal from 'decimal.js';

/**
 * Digits after the decimal point of a currency's minor unit, as ISO 4217 lists them
 * (USD 2, JPY 0, BHD 3), read from the `currency-codes` package's copy of the ISO table.
 * Undefined for a code ISO 4217 does not list.
 */
const digitsByCode = new Map<string, number | undefined>();

export function minorUnitDigits(currency: string): number | undefined {
  // The package searches its table linearly; every line of every estimate asks, so remember.
  if (!digitsByCode.has(currency)) digitsByCode.set(currency, currencyByCode(currency.toUpperCase())?.digits);
  return digitsByCode.get(currency);
}

export function isKnownCurrency(currency: string): boolean {
  return /^[A-Z]{3}$/.test(currency) && minorUnitDigits(currency) !== undefined;
}

/** Rounds half up (away from zero for the positive amounts we price) to the currency's minor unit. */
export function roundToMinorUnit(amount: Decimal.Value, currency: string): Decimal {
  const digits = minorUnitDigits(currency);
  if (digits === undefined) throw new Error(`Unknown ISO 4217 currency ${currency}`);
  return new Decimal(amount).toDecimalPlaces(digits, Decimal.ROUND_HALF_UP);
}

/** A money amount as the API sends it: a decimal string with exactly the minor unit's digits. */
export function formatMoney(amount: Decimal.Value, currency: string): string {
  const digits = minorUnitDigits(currency);
  if (digits === undefined) throw new Error(`Unknown ISO 4217 currency ${currency}`);
  return new Decimal(amount).toFixed(digits, Decimal.ROUND_HALF_UP);
}

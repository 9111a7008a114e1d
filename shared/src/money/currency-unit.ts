import { ISO_4217_MINOR_UNITS } from './iso-4217';

/**
 * The one place the product learns how finely a currency's money is counted: the estimate engine,
 * money facts, payments and formatting all ask here, so a price, its deposit, what the payment
 * provider is asked to charge and what a page shows can never disagree.
 *
 * Two published tables meet here:
 *
 * 1. ISO 4217, List One, column "Minor unit" (the registry's `currency-codes` dataset, written to
 *    iso-4217.ts by shared/scripts/iso-4217.mjs and checked against the dataset by iso-4217.spec.ts):
 *    how many decimals a currency's amounts are written with (USD 2, JPY 0, KWD 3, HUF 2, IDR 2).
 * 2. The payment provider's "Supported currencies" page (docs.stripe.com/currencies), which states
 *    how it wants charge amounts: an integer in the currency's smallest unit, with the exceptions
 *    in the three tables below. The provider's own test double (api/fakes/payment) keeps its own,
 *    separately written copy of these tables, so a mistake here shows up as a refused or wrong
 *    charge in the tests instead of being shared by both sides.
 */

/**
 * Provider table "Zero-decimal currencies" (docs.stripe.com/currencies#zero-decimal): the amount is
 * the whole number of units, not multiplied by 100 (¥500 is 500). MGA is listed here although ISO
 * 4217 gives it two decimals; its fifths (iraimbilanja) are not decimal anyway.
 */
export const PROVIDER_ZERO_DECIMAL = [
  'BIF',
  'CLP',
  'DJF',
  'GNF',
  'JPY',
  'KMF',
  'KRW',
  'MGA',
  'PYG',
  'RWF',
  'UGX',
  'VND',
  'VUV',
  'XAF',
  'XOF',
  'XPF',
] as const;

/**
 * Provider table "Three-decimal currencies" (docs.stripe.com/currencies#three-decimal): amounts in
 * thousandths, but the last digit must be 0, so a charge is rounded to the nearest ten
 * (5.124 KWD is sent as 5120). In effect these are charged in hundredths.
 */
export const PROVIDER_THREE_DECIMAL = ['BHD', 'JOD', 'KWD', 'OMR', 'TND'] as const;

/**
 * Provider "Special cases" (docs.stripe.com/currencies#special-cases): amounts are written with two
 * decimals, but only whole units can be charged or paid out, so the integer must be divisible by
 * 100 (ISK 5 is 500). ISK is zero-decimal for the provider but kept in two-decimal form for
 * backwards compatibility; HUF and TWD are paid out only in whole units, so we charge whole units
 * too, and a balance can always be paid out whole.
 */
export const PROVIDER_WHOLE_UNITS_IN_HUNDREDTHS = ['HUF', 'ISK', 'TWD'] as const;

export interface CurrencyUnit {
  /** ISO 4217 code, upper case. */
  code: string;
  /** ISO 4217 "Minor unit" digits. */
  isoDigits: number;
  /**
   * Decimals every amount in the product is rounded to: the finer of what ISO writes and what the
   * provider can charge (USD 2, JPY 0, KWD 2, HUF 0, IDR 2). Prices, deposits, balances and
   * refunds are all multiples of one such unit, so whatever is due can be charged exactly.
   */
  digits: number;
  /** Power of ten the provider's integer amount is counted in (USD 2, JPY 0, KWD 3, HUF 2). */
  providerExponent: number;
}

const units = new Map<string, CurrencyUnit | undefined>();

function unitFor(code: string): CurrencyUnit | undefined {
  const iso = ISO_4217_MINOR_UNITS[code];
  if (iso === undefined) return undefined;
  if ((PROVIDER_ZERO_DECIMAL as readonly string[]).includes(code)) return { code, isoDigits: iso, digits: 0, providerExponent: 0 };
  if ((PROVIDER_THREE_DECIMAL as readonly string[]).includes(code)) return { code, isoDigits: iso, digits: 2, providerExponent: 3 };
  if ((PROVIDER_WHOLE_UNITS_IN_HUNDREDTHS as readonly string[]).includes(code))
    return { code, isoDigits: iso, digits: 0, providerExponent: 2 };
  return { code, isoDigits: iso, digits: iso, providerExponent: iso };
}

/** The currency's unit, or undefined when ISO 4217 does not list the code. */
export function currencyUnit(currency: string): CurrencyUnit | undefined {
  const code = currency.trim().toUpperCase();
  // Every line of every estimate asks, so remember.
  if (!units.has(code)) units.set(code, /^[A-Z]{3}$/.test(code) ? unitFor(code) : undefined);
  return units.get(code);
}

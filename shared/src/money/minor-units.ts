import { code as currencyByCode } from 'currency-codes';
import Decimal from 'decimal.js';

/**
 * The one place the product learns how finely a currency's money is counted: the estimate engine,
 * money facts, payments and formatting all ask here, so a price, its deposit, what the payment
 * provider is asked to charge and what a page shows can never disagree.
 *
 * Two published tables meet here:
 *
 * 1. ISO 4217, List One, column "Minor unit" (read from the registry's `currency-codes` dataset):
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
  'BIF', 'CLP', 'DJF', 'GNF', 'JPY', 'KMF', 'KRW', 'MGA', 'PYG', 'RWF', 'UGX', 'VND', 'VUV', 'XAF', 'XOF', 'XPF',
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
  const iso = currencyByCode(code)?.digits;
  if (iso === undefined) return undefined;
  if ((PROVIDER_ZERO_DECIMAL as readonly string[]).includes(code)) return { code, isoDigits: iso, digits: 0, providerExponent: 0 };
  if ((PROVIDER_THREE_DECIMAL as readonly string[]).includes(code)) return { code, isoDigits: iso, digits: 2, providerExponent: 3 };
  if ((PROVIDER_WHOLE_UNITS_IN_HUNDREDTHS as readonly string[]).includes(code)) return { code, isoDigits: iso, digits: 0, providerExponent: 2 };
  return { code, isoDigits: iso, digits: iso, providerExponent: iso };
}

/** The currency's unit, or undefined when ISO 4217 does not list the code. */
export function currencyUnit(currency: string): CurrencyUnit | undefined {
  const code = currency.trim().toUpperCase();
  // The dataset is searched linearly and every line of every estimate asks, so remember.
  if (!units.has(code)) units.set(code, /^[A-Z]{3}$/.test(code) ? unitFor(code) : undefined);
  return units.get(code);
}

function requireUnit(currency: string): CurrencyUnit {
  const unit = currencyUnit(currency);
  if (!unit) throw new Error(`Unknown ISO 4217 currency ${currency}`);
  return unit;
}

/** Decimals the product counts this currency's money in (see `CurrencyUnit.digits`); undefined for an unknown code. */
export function minorUnitDigits(currency: string): number | undefined {
  return currencyUnit(currency)?.digits;
}

export function isKnownCurrency(currency: string): boolean {
  return /^[A-Z]{3}$/.test(currency) && currencyUnit(currency) !== undefined;
}

/** Rounds half up (away from zero for the positive amounts we price) to the currency's unit. */
export function roundToMinorUnit(amount: Decimal.Value, currency: string): Decimal {
  return new Decimal(amount).toDecimalPlaces(requireUnit(currency).digits, Decimal.ROUND_HALF_UP);
}

/** A money amount as the API sends it: a decimal string with exactly the currency's digits ("12.50", "1235"). */
export function formatMoney(amount: Decimal.Value, currency: string): string {
  return new Decimal(amount).toFixed(requireUnit(currency).digits, Decimal.ROUND_HALF_UP);
}

/**
 * "350.00" USD → 35000, "1235" HUF → 123500, "12.35" KWD → 12350: the integer the provider takes.
 * Rounds half up to the currency's unit first, so the result always obeys the provider's tables.
 */
export function toProviderAmount(amount: Decimal.Value, currency: string): number {
  const unit = requireUnit(currency);
  const minor = new Decimal(amount).toDecimalPlaces(unit.digits, Decimal.ROUND_HALF_UP).times(new Decimal(10).pow(unit.providerExponent));
  if (!minor.isInteger() || !minor.abs().lte(Number.MAX_SAFE_INTEGER)) throw new Error(`${amount} ${unit.code} cannot be sent as a provider amount`);
  return minor.toNumber();
}

/** The provider's integer back to a decimal string in the currency's digits (123500 HUF → "1235"). */
export function fromProviderAmount(minor: number | string, currency: string): string {
  const unit = requireUnit(currency);
  return new Decimal(minor).dividedBy(new Decimal(10).pow(unit.providerExponent)).toFixed(unit.digits, Decimal.ROUND_HALF_UP);
}

import Decimal from 'decimal.js';
import { currencyUnit, type CurrencyUnit } from './currency-unit';

// The tables and their sources are in currency-unit.ts (kept free of decimal.js, so the apps' first
// page can format money without loading it); the arithmetic on amounts is here.
export {
  currencyUnit,
  PROVIDER_THREE_DECIMAL,
  PROVIDER_WHOLE_UNITS_IN_HUNDREDTHS,
  PROVIDER_ZERO_DECIMAL,
  type CurrencyUnit,
} from './currency-unit';

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
  if (!minor.isInteger() || !minor.abs().lte(Number.MAX_SAFE_INTEGER))
    throw new Error(`${amount} ${unit.code} cannot be sent as a provider amount`);
  return minor.toNumber();
}

/** The provider's integer back to a decimal string in the currency's digits (123500 HUF → "1235"). */
export function fromProviderAmount(minor: number | string, currency: string): string {
  const unit = requireUnit(currency);
  return new Decimal(minor).dividedBy(new Decimal(10).pow(unit.providerExponent)).toFixed(unit.digits, Decimal.ROUND_HALF_UP);
}

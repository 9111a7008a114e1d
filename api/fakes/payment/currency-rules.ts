import { RequestError } from './params';

/**
 * The fake's own reading of how the provider counts amounts, written from its "Supported
 * currencies" page (docs.stripe.com/currencies) and from ISO 4217, independently of the product's
 * `@loomwright/shared` money code on purpose: if the product gets a currency wrong, the fake refuses
 * or shows the charge differently and a test sees it. Do not import product code here.
 */

/** "Zero-decimal currencies": the amount is whole units (¥500 is 500). */
const ZERO_DECIMAL = new Set([
  'bif',
  'clp',
  'djf',
  'gnf',
  'jpy',
  'kmf',
  'krw',
  'mga',
  'pyg',
  'rwf',
  'ugx',
  'vnd',
  'vuv',
  'xaf',
  'xof',
  'xpf',
]);

/** "Three-decimal currencies": thousandths, and the least significant digit must be 0. */
const THREE_DECIMAL = new Set(['bhd', 'jod', 'kwd', 'omr', 'tnd']);

/**
 * "Special cases": ISK is zero-decimal but still sent with two decimals; HUF and TWD are charged in
 * two-decimal form but paid out only in whole units. In all three the amount must be divisible by 100.
 */
const WHOLE_UNITS_IN_HUNDREDTHS = new Set(['isk', 'huf', 'twd']);

/**
 * ISO 4217 List One, "Minor unit" column, for the codes whose minor unit is not 2 (from the
 * published list, written out here; every other listed code has 2). Used only where the provider's
 * tables above say nothing.
 */
const ISO_MINOR_UNIT_NOT_TWO: Record<string, number> = {
  bhd: 3,
  bif: 0,
  clf: 4,
  clp: 0,
  djf: 0,
  gnf: 0,
  iqd: 3,
  isk: 0,
  jod: 3,
  jpy: 0,
  kmf: 0,
  krw: 0,
  kwd: 3,
  lyd: 3,
  omr: 3,
  pyg: 0,
  rwf: 0,
  tnd: 3,
  ugx: 0,
  uyi: 0,
  uyw: 4,
  vnd: 0,
  vuv: 0,
  xaf: 0,
  xof: 0,
  xpf: 0,
};

/** The power of ten the provider's integer amount is counted in. */
export function amountExponent(currency: string): number {
  const c = currency.toLowerCase();
  if (ZERO_DECIMAL.has(c)) return 0;
  if (THREE_DECIMAL.has(c)) return 3;
  if (WHOLE_UNITS_IN_HUNDREDTHS.has(c)) return 2;
  return ISO_MINOR_UNIT_NOT_TWO[c] ?? 2;
}

/** Refuses an amount the provider would refuse, with words close to its own. */
export function checkAmountForCurrency(amount: number, currency: string, param: string): number {
  const c = currency.toLowerCase();
  if (THREE_DECIMAL.has(c) && amount % 10 !== 0) {
    throw new RequestError(
      400,
      `Invalid ${param}: amounts in ${c} must end in 0 (three-decimal currencies are charged to the nearest ten; round ${amount} to ${Math.round(amount / 10) * 10}).`,
      param,
    );
  }
  if (WHOLE_UNITS_IN_HUNDREDTHS.has(c) && amount % 100 !== 0) {
    throw new RequestError(
      400,
      `Invalid ${param}: amounts in ${c} must be whole units, an integer divisible by 100 (got ${amount}).`,
      param,
    );
  }
  return amount;
}

/** The provider's integer as a decimal string in major units: 123456 usd → "1234.56", 1235 jpy → "1235". */
export function majorUnits(amount: number, currency: string): string {
  const exp = amountExponent(currency);
  if (exp === 0) return String(amount);
  const digits = String(Math.abs(amount)).padStart(exp + 1, '0');
  return `${amount < 0 ? '-' : ''}${digits.slice(0, -exp)}.${digits.slice(-exp)}`;
}

import Decimal from 'decimal.js';

/**
 * An exact decimal, `n × 10^-scale`, for the estimate's per-line sums: every figure of a price book
 * is read through decimal.js once (see book-index.ts), and the few products, sums and roundings an
 * estimate makes are then done on integers, which is exact at any size (BigInt) and far quicker
 * than a Decimal per step. Rounding is ROUND_HALF_UP as decimal.js does it (half away from zero),
 * and the written form matches `Decimal#toFixed`; exact.spec.ts checks both against decimal.js.
 *
 * Within the price book schema's bounds (nine integer digits, four decimals) decimal.js's default
 * 20-digit precision never rounds an estimate's products, so the two agree to the last digit.
 */
export interface Exact {
  readonly n: bigint;
  readonly scale: number;
}

const SAFE = BigInt(Number.MAX_SAFE_INTEGER);
const powers: bigint[] = [1n];
/** 10^k as a BigInt (kept: the same few are asked for all the time). */
function pow10(k: number): bigint {
  for (let i = powers.length; i <= k; i++) powers.push(powers[i - 1] * 10n);
  return powers[k];
}

/** The Decimal's value, every digit kept (no exponent, no rounding). */
export function exactOf(value: Decimal): Exact {
  const text = value.toFixed();
  const point = text.indexOf('.');
  return point < 0
    ? { n: BigInt(text), scale: 0 }
    : { n: BigInt(text.slice(0, point) + text.slice(point + 1)), scale: text.length - point - 1 };
}

/** A price book figure (a decimal string) as an exact decimal; each distinct string is read through decimal.js once. */
const figures = new Map<string, Exact>();
export function figure(value: string): Exact {
  let e = figures.get(value);
  if (!e) {
    if (figures.size > 4096) figures.clear();
    e = exactOf(new Decimal(value));
    figures.set(value, e);
  }
  return e;
}

export const exactInt = (k: number): Exact => ({ n: BigInt(k), scale: 0 });

export const times = (a: Exact, b: Exact): Exact => ({ n: a.n * b.n, scale: a.scale + b.scale });

export const timesInt = (a: Exact, k: number): Exact => ({ n: a.n * BigInt(k), scale: a.scale });

export function plus(a: Exact, b: Exact): Exact {
  if (a.scale === b.scale) return { n: a.n + b.n, scale: a.scale };
  return a.scale > b.scale
    ? { n: a.n + b.n * pow10(a.scale - b.scale), scale: a.scale }
    : { n: a.n * pow10(b.scale - a.scale) + b.n, scale: b.scale };
}

/** -1, 0 or 1 as a is below, equal to or above b. */
export function compare(a: Exact, b: Exact): number {
  const d = plus(a, { n: -b.n, scale: b.scale }).n;
  return d < 0n ? -1 : d > 0n ? 1 : 0;
}

export const ZERO: Exact = { n: 0n, scale: 0 };

/** Rounded to `digits` decimals, half away from zero (decimal.js ROUND_HALF_UP); unchanged when it has no more. */
export function roundHalfUp(a: Exact, digits: number): Exact {
  if (a.scale <= digits) return a;
  const unit = pow10(a.scale - digits);
  let q = a.n / unit;
  const r = a.n % unit;
  const twice = (r < 0n ? -r : r) * 2n;
  if (twice >= unit) q += a.n < 0n ? -1n : 1n;
  return { n: q, scale: digits };
}

/**
 * Written with exactly `digits` decimals, rounded half up when it has more: what `Decimal#toFixed(digits,
 * ROUND_HALF_UP)` writes, down to the minus sign it keeps on a negative amount that rounds to zero.
 */
export function toFixedText(a: Exact, digits: number): string {
  const r = roundHalfUp(a, digits);
  const n = r.scale < digits ? r.n * pow10(digits - r.scale) : r.n;
  const negative = n < 0n || (n === 0n && a.n < 0n);
  const magnitude = n < 0n ? -n : n;
  // A number writes its digits quicker than a BigInt does; below 2^53 it holds them exactly.
  const abs = magnitude <= SAFE ? String(Number(magnitude)) : magnitude.toString();
  if (digits === 0) return negative ? `-${abs}` : abs;
  const padded = abs.length > digits ? abs : abs.padStart(digits + 1, '0');
  const cut = padded.length - digits;
  return `${negative ? '-' : ''}${padded.slice(0, cut)}.${padded.slice(cut)}`;
}

/** The plain decimal string, every digit (as `Decimal#toFixed()` with no argument writes it). */
export function toPlainText(a: Exact): string {
  return toFixedText(a, a.scale).replace(/^-(0(\.0*)?)$/, '$1');
}

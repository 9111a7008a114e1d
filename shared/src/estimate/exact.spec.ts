import Decimal from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compare, exactOf, figure, plus, roundHalfUp, times, timesInt, toFixedText, toPlainText } from './exact';

// The reference is decimal.js 10.6.0 (npm registry), the library the product keeps for money: its
// times, plus, toDecimalPlaces(ROUND_HALF_UP) and toFixed are what the engine's integer arithmetic
// must reproduce digit for digit. Operands stay within what an estimate multiplies: a price book
// figure (the schema allows nine integer digits and four decimals; a price at most six) times a
// quantity (feet or hours for up to 61 devices). Their products stay within decimal.js's default 20
// significant digits, where it is exact; beyond them decimal.js rounds and the integers do not.
const decimalText = (max: bigint) =>
  fc.tuple(fc.boolean(), fc.bigInt({ min: 0n, max }), fc.integer({ min: 0, max: 4 })).map(([negative, n, scale]) => {
    const digits = n.toString().padStart(scale + 1, '0');
    const text = scale === 0 ? digits : `${digits.slice(0, -scale)}.${digits.slice(-scale)}`;
    return negative ? `-${text}` : text;
  });
const price = decimalText(999_999_9999n);
const quantity = decimalText(99_999_9999n);
const digitsArb = fc.integer({ min: 0, max: 4 });

describe('exact decimals against decimal.js', () => {
  it('reads a figure with every digit', () => {
    fc.assert(
      fc.property(decimalText(999_999_999_9999n), (text) => {
        expect(toPlainText(figure(text))).toBe(new Decimal(text).toFixed());
      }),
    );
    // decimal.js also takes exponents and bare points; the figure is the same number.
    expect(toPlainText(exactOf(new Decimal('1.5e3')))).toBe('1500');
    expect(toPlainText(exactOf(new Decimal('.25')))).toBe('0.25');
  });

  it('multiplies, adds and rounds half up (away from zero) as decimal.js does', () => {
    fc.assert(
      fc.property(price, quantity, fc.integer({ min: 0, max: 200 }), digitsArb, (a, b, k, digits) => {
        const ea = figure(a);
        const eb = figure(b);
        const da = new Decimal(a);
        const db = new Decimal(b);
        const round = (d: Decimal) => d.toDecimalPlaces(digits, Decimal.ROUND_HALF_UP).toFixed(digits);
        expect(toFixedText(roundHalfUp(times(ea, eb), digits), digits)).toBe(round(da.times(db)));
        expect(toFixedText(roundHalfUp(timesInt(ea, k), digits), digits)).toBe(round(da.times(k)));
        expect(toFixedText(plus(ea, eb), digits)).toBe(da.plus(db).toFixed(digits, Decimal.ROUND_HALF_UP));
        expect(toFixedText(ea, digits)).toBe(da.toFixed(digits, Decimal.ROUND_HALF_UP));
        expect(compare(ea, eb)).toBe(da.comparedTo(db));
      }),
      { numRuns: 2_000 },
    );
  });

  it('rounds the halves and writes the signs as decimal.js does', () => {
    for (const text of ['0.005', '0.015', '-0.005', '-0.001', '0.0049', '2.5', '-2.5', '999.995', '0', '-0', '0.00']) {
      for (const digits of [0, 1, 2, 3]) {
        const d = new Decimal(text);
        expect(toFixedText(figure(text), digits), `${text} to ${digits}`).toBe(d.toFixed(digits, Decimal.ROUND_HALF_UP));
        expect(toFixedText(roundHalfUp(figure(text), digits), digits), `${text} rounded to ${digits}`).toBe(
          d.toDecimalPlaces(digits, Decimal.ROUND_HALF_UP).toFixed(digits),
        );
      }
    }
  });
});

import cc from 'currency-codes';
import { describe, expect, it } from 'vitest';
import { fromMinorUnits, minorUnitDigits, toMinorUnits } from './minor-units';

describe('amounts in the currency minor unit the payment provider takes', () => {
  it('uses the ISO 4217 minor-unit digits (cross-checked with the currency-codes dataset)', () => {
    // ISO 4217 list one, "Minor unit" column: USD 2, EUR 2, JPY 0, KRW 0, BHD 3, KWD 3.
    for (const code of ['USD', 'EUR', 'GBP', 'JPY', 'KRW', 'BHD', 'KWD']) {
      expect(minorUnitDigits(code), code).toBe(cc.code(code)!.digits);
    }
  });

  it('converts decimal strings exactly, rounding half up at the minor unit', () => {
    expect(toMinorUnits('632.13', 'USD')).toBe(63213);
    expect(toMinorUnits('0.1', 'USD') + toMinorUnits('0.2', 'USD')).toBe(30); // no float drift
    expect(toMinorUnits('0.005', 'USD')).toBe(1);
    expect(toMinorUnits('1200', 'JPY')).toBe(1200);
    expect(toMinorUnits('1.2345', 'BHD')).toBe(1235);
    expect(fromMinorUnits(63213, 'USD')).toBe('632.13');
    expect(fromMinorUnits('1235', 'BHD')).toBe('1.235');
  });
});

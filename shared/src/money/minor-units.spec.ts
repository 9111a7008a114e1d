import { data as iso4217 } from 'currency-codes';
import { describe, expect, it } from 'vitest';
import { currencyUnit, formatMoney, fromProviderAmount, minorUnitDigits, roundToMinorUnit, toProviderAmount } from './minor-units';

describe('one source of minor units: ISO 4217 with the payment provider’s charge rules', () => {
  it('ISO 4217 List One "Minor unit" column, as published (written out here, not read from the dataset)', () => {
    // ISO 4217 List One (SIX, amendment 176 and later): USD 2, EUR 2, JPY 0, KWD 3, BHD 3, HUF 2,
    // IDR 2, COP 2, ISK 0, UGX 0, CLF 4, UYW 4.
    const published: Record<string, number> = {
      USD: 2,
      EUR: 2,
      JPY: 0,
      KWD: 3,
      BHD: 3,
      HUF: 2,
      IDR: 2,
      COP: 2,
      ISK: 0,
      UGX: 0,
      CLF: 4,
      UYW: 4,
    };
    for (const [code, digits] of Object.entries(published)) expect(currencyUnit(code)?.isoDigits, code).toBe(digits);
  });

  it('every ISO code of the dataset has a unit, and unknown codes have none', () => {
    for (const c of iso4217) if (c.digits !== undefined) expect(currencyUnit(c.code), c.code).toBeDefined();
    expect(currencyUnit('XYZ')).toBeUndefined();
    expect(currencyUnit('usd')?.code).toBe('USD');
    expect(minorUnitDigits('12')).toBeUndefined();
  });

  /**
   * Expected provider amounts worked by hand from the provider's "Supported currencies" page
   * (docs.stripe.com/currencies): "Minor units in API amounts" (10 USD is 1000), "Zero-decimal
   * currencies" (¥500 is 500; UGX, MGA listed), "Three-decimal currencies" (5.124 KWD is sent as
   * 5120 or 5130: the last digit must be 0), "Special cases" (ISK, HUF, TWD: two-decimal form,
   * whole units only, so divisible by 100).
   */
  it.each([
    ['USD', '1234.56', 123456],
    ['EUR', '1234.56', 123456],
    ['JPY', '1234.56', 1235],
    ['HUF', '1234.56', 123500],
    ['TWD', '1234.49', 123400],
    ['ISK', '1234.56', 123500],
    ['IDR', '1234.56', 123456],
    ['COP', '1234.56', 123456],
    ['KWD', '5.124', 5120],
    ['KWD', '5.125', 5130],
    ['BHD', '12.3', 12300],
    ['UGX', '1234.56', 1235],
    ['MGA', '1234.56', 1235],
  ])('%s %s is sent to the provider as %i', (currency, amount, minor) => {
    expect(toProviderAmount(amount, currency)).toBe(minor);
  });

  it('every provider amount obeys the provider’s tables for every ISO code', () => {
    const threeDecimal = ['BHD', 'JOD', 'KWD', 'OMR', 'TND'];
    const hundredsOnly = ['HUF', 'ISK', 'TWD'];
    for (const c of iso4217) {
      if (c.digits === undefined) continue;
      const minor = toProviderAmount('1234.5678', c.code);
      if (threeDecimal.includes(c.code)) expect(minor % 10, c.code).toBe(0);
      if (hundredsOnly.includes(c.code)) expect(minor % 100, c.code).toBe(0);
      // Round trip: what the product records is exactly what was charged.
      expect(toProviderAmount(fromProviderAmount(minor, c.code), c.code), c.code).toBe(minor);
    }
  });

  it('amounts in the product are multiples of one chargeable unit, so a deposit or balance can be charged exactly', () => {
    expect(roundToMinorUnit('1234.56', 'HUF').toFixed()).toBe('1235');
    expect(formatMoney('1234.5', 'HUF')).toBe('1235');
    expect(formatMoney('12.345', 'KWD')).toBe('12.35');
    expect(formatMoney('1234.5', 'IDR')).toBe('1234.50');
    expect(fromProviderAmount(123500, 'HUF')).toBe('1235');
    expect(fromProviderAmount(12350, 'KWD')).toBe('12.35');
    expect(fromProviderAmount(1235, 'JPY')).toBe('1235');
  });

  it('converts without float drift and refuses an unknown code', () => {
    expect(toProviderAmount('0.1', 'USD') + toProviderAmount('0.2', 'USD')).toBe(30);
    expect(toProviderAmount('632.13', 'USD')).toBe(63213);
    expect(() => toProviderAmount('1', 'XYZ')).toThrow(/Unknown ISO 4217 currency/);
  });
});

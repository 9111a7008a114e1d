import { describe, expect, it } from 'vitest';
import { addDays, endOfMonth, formatHours, formatMoney, isoWeekday, startOfWeek } from './format';

describe('money as the shop reads it', () => {
  it('groups and rounds like the platform currency formatter, but from decimal strings', () => {
    // Reference: ECMA-402 Intl.NumberFormat (en-US, USD), the browser's own currency formatting.
    const reference = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' });
    for (const amount of ['0', '5', '983.95', '1120', '1234567.891', '2420.75']) {
      expect(formatMoney(amount, 'USD')).toBe(reference.format(Number(amount)));
    }
  });

  it('keeps cents a float would lose', () => {
    // 0.1 + 0.2 in binary floating point is 0.30000000000000004 (IEEE 754); the decimal stays 0.30.
    expect(formatMoney('0.30000000000000000001', 'USD')).toBe('$0.30');
    expect(formatMoney('9007199254740993.10', 'USD')).toBe('$9,007,199,254,740,993.10');
  });

  it('says "—" when there is no amount, and writes hours plainly', () => {
    expect(formatMoney(null)).toBe('—');
    expect(formatHours('13.50')).toBe('13.5 hr'); // CLDR en short unit for hour
    expect(formatHours(7)).toBe('7 hr');
  });
});

describe('calendar days without time zones', () => {
  it('knows ISO weekdays and week starts (ISO 8601: weeks start on Monday)', () => {
    // 1 December 2026 is a Tuesday (from memory, cross-checked with Date.UTC's own weekday below).
    expect(new Date(Date.UTC(2026, 11, 1)).getUTCDay()).toBe(2);
    expect(isoWeekday('2026-12-01')).toBe(2);
    expect(isoWeekday('2026-12-06')).toBe(7);
    expect(startOfWeek('2026-12-06')).toBe('2026-11-30');
  });

  it('crosses month and leap-year ends', () => {
    // Gregorian rule: 2028 is a leap year (divisible by 4, not by 100).
    expect(endOfMonth('2028-02-10')).toBe('2028-02-29');
    expect(endOfMonth('2026-02-10')).toBe('2026-02-28');
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
  });
});

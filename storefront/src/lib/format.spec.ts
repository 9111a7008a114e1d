import { describe, expect, it } from 'vitest';
import { formatDay, formatHours, formatMoment, formatMoney, formatMoneyRange } from './format';

// The default voice (en-US, USD, UTC) until ShopVoice has read the shop's settings. Expected strings
// are CLDR en output (Node's full ICU): currency pattern "¤#,##0.00", range "{0} – {1}", hour unit "hr".
describe('the storefront writes through the one shared formatter', () => {
  it('money always carries the currency’s minor unit, from decimal strings', () => {
    expect(formatMoney('1120.00', 'USD')).toBe('$1,120.00');
    expect(formatMoney('837.5', 'USD')).toBe('$837.50');
    // 2^53 + 1: a float would lose the last digit.
    expect(formatMoney('9007199254740993.00', 'USD')).toBe('$9,007,199,254,740,993.00');
    expect(formatMoney('3500', 'JPY')).toBe('¥3,500');
  });

  it('ranges and hours', () => {
    expect(formatMoneyRange('1120.00', '1400.00', 'USD')).toBe('$1,120.00 – $1,400.00');
    expect(formatMoneyRange('500.00', '500', 'USD')).toBe('$500.00');
    expect(formatHours('14.00')).toBe('14 hr');
    expect(formatHours('13.50')).toBe('13.5 hr');
  });

  it('days never move with a time zone; moments carry the zone', () => {
    expect(formatDay('2027-01-12')).toBe('Tue, Jan 12, 2027');
    expect(formatMoment('2026-12-08T23:45:00Z')).toBe('Tue, Dec 8, 2026, 11:45 PM UTC');
  });
});

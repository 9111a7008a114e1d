import { describe, expect, it } from 'vitest';
import { formatHours, formatMoney, formatMoneyRange } from './money';

// Expected strings follow ECMA-402 Intl.NumberFormat with the CLDR en-US pattern "¤#,##0.00"
// (grouping by thousands with ",", the symbol "$" before the figure) — CLDR, Unicode Consortium.
describe('money as the player reads it', () => {
  it('drops cents only when there are none', () => {
    expect(formatMoney('1120.00', 'USD')).toBe('$1,120');
    expect(formatMoney('837.50', 'USD')).toBe('$837.50');
    expect(formatMoney('1234567.8', 'USD')).toBe('$1,234,567.80');
  });

  it('formats a decimal string exactly, without a float on the way', () => {
    // 0.1 + 0.2 in binary floating point is 0.30000000000000004 (IEEE 754); the string stays exact.
    expect(formatMoney('0.30', 'USD')).toBe('$0.30');
    expect(formatMoney('9007199254740993.00', 'USD')).toBe('$9,007,199,254,740,993');
  });

  it('writes a range with an en dash and one precision for both ends', () => {
    expect(formatMoneyRange('1120.00', '1400.00', 'USD')).toBe('$1,120–$1,400');
    expect(formatMoneyRange('1073.20', '1163.00', 'USD')).toBe('$1,073.20–$1,163.00');
    expect(formatMoneyRange('500.00', '500.00', 'USD')).toBe('$500');
  });

  it('says hours plainly', () => {
    expect(formatHours('14.00')).toBe('14 h');
    expect(formatHours('13.50')).toBe('13.5 h');
    expect(formatHours('7')).toBe('7 h');
  });
});

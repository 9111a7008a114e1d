import { describe, expect, it } from 'vitest';
import { presetRanges, shopToday } from './date-ranges';

describe('presetRanges', () => {
  it('gives whole months, quarters and years of the Gregorian calendar (2028 is a leap year: ISO 8601 uses the Gregorian rule)', () => {
    const byLabel = Object.fromEntries(presetRanges('2028-02-15').map((p) => [p.label, p.range]));
    expect(byLabel['This month']).toEqual({ from: '2028-02-01', to: '2028-02-29' });
    expect(byLabel['Last month']).toEqual({ from: '2028-01-01', to: '2028-01-31' });
    expect(byLabel['This quarter']).toEqual({ from: '2028-01-01', to: '2028-03-31' });
    expect(byLabel['This year']).toEqual({ from: '2028-01-01', to: '2028-12-31' });
  });

  it('steps back over a year end for last month, and the fourth quarter ends on 31 December', () => {
    const byLabel = Object.fromEntries(presetRanges('2027-01-03').map((p) => [p.label, p.range]));
    expect(byLabel['Last month']).toEqual({ from: '2026-12-01', to: '2026-12-31' });
    expect(Object.fromEntries(presetRanges('2026-11-30').map((p) => [p.label, p.range]))['This quarter']).toEqual({
      from: '2026-10-01',
      to: '2026-12-31',
    });
  });

  it('reads today on the shop’s clock: 03:00 UTC on 1 Dec is still 30 Nov in Chicago (IANA tz, UTC−6)', () => {
    expect(shopToday('America/Chicago', new Date('2026-12-01T03:00:00Z'))).toBe('2026-11-30');
    expect(shopToday('Asia/Tokyo', new Date('2026-12-01T03:00:00Z'))).toBe('2026-12-01');
  });
});

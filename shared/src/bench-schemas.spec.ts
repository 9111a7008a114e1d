import { describe, expect, it } from 'vitest';
import { dateShiftWords } from './bench-dates';
import { absenceSchema, rescheduleSchema } from './bench-schemas';
import { isCalendarDay } from './request-fields';

describe('dateShiftWords', () => {
  it('calls a later day later and an earlier day earlier, across months and a leap day', () => {
    expect(dateShiftWords('2026-12-07', '2026-12-10')).toBe('3 days later');
    expect(dateShiftWords('2026-12-10', '2026-12-07')).toBe('3 days earlier');
    expect(dateShiftWords('2026-12-07', '2026-12-08')).toBe('1 day later');
    expect(dateShiftWords('2026-12-07', '2026-12-07')).toBe('the same day');
    // 2028 is a leap year (Gregorian rule: divisible by 4, not a century): 28 Feb → 1 Mar is 2 days.
    expect(dateShiftWords('2028-02-28', '2028-03-01')).toBe('2 days later');
    expect(dateShiftWords('2027-02-28', '2027-03-01')).toBe('1 day later');
  });
});

describe('the reschedule and absence schemas', () => {
  it('accepts a real day and refuses an impossible one (ISO 8601 calendar dates)', () => {
    expect(isCalendarDay('2028-02-29')).toBe(true);
    expect(isCalendarDay('2027-02-29')).toBe(false);
    expect(isCalendarDay('2026-13-01')).toBe(false);
  });

  it('names each bad field in words', () => {
    const result = rescheduleSchema.safeParse({ builderId: 'x', benchDate: '2026-02-30', reason: '  ', surprise: true });
    expect(result.success).toBe(false);
    const messages = result.error!.issues.map((i) => i.message);
    expect(messages).toEqual(
      expect.arrayContaining([
        'Choose a builder from the list; this one is not known here',
        'Bench date must be a real calendar day, like 2026-12-14',
        'Reason is required: say why the build moves (the player reads it)',
        '"surprise" is not a field this request takes; remove it',
      ]),
    );
    expect(
      rescheduleSchema.parse({ builderId: '3f1c2a4e-8b7d-4c6e-9a5b-1d2e3f4a5b6c', benchDate: '2026-12-07', reason: ' late parcel ' })
        .reason,
    ).toBe('late parcel');
  });

  it('refuses an absence that ends before it starts', () => {
    const result = absenceSchema.safeParse({ startsOn: '2026-12-10', endsOn: '2026-12-09', reason: 'ill' });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]).toMatchObject({ path: ['endsOn'], message: 'Last day must be on or after the first day' });
  });
});

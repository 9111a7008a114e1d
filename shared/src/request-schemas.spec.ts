import { describe, expect, it } from 'vitest';
import { proposeExtraSchema, timeEntryFormSchema, timeEntrySchema } from './build-schemas';
import { describeIssues } from './estimate/schema';
import { isCalendarDay } from './request-fields';
import { teamMemberFormSchema, updateTeamMemberSchema } from './team-schemas';

const messages = (result: { success: boolean; error?: Parameters<typeof describeIssues>[0] }) =>
  result.success ? [] : describeIssues(result.error!);

describe('hours: the form takes what the API takes, in the same words', () => {
  // IEEE 754 binary64: 2.3 × 100 = 229.99999999999997, so a check by multiplying refuses 2.3 h (the old form's bug).
  it.each(['2.3', '0.25', '24', '7.5', '0.01'])('takes %s h in the form and as a number in the API', (typed) => {
    const form = timeEntryFormSchema.safeParse({ workedOn: '2026-11-30', hours: typed, note: '' });
    expect(form.success).toBe(true);
    expect(timeEntrySchema.safeParse({ workedOn: '2026-11-30', hours: Number(typed) }).success).toBe(true);
  });

  it.each([
    ['0', 'Hours must be more than 0'],
    ['24.5', 'Hours can be at most 24 for one day'],
    ['2.345', 'Hours takes at most two decimals, like 1.25'],
  ])('refuses %s h with the same words in the form and the API', (typed, words) => {
    expect(messages(timeEntryFormSchema.safeParse({ workedOn: '2026-11-30', hours: typed, note: '' }))).toEqual([words]);
    expect(messages(timeEntrySchema.safeParse({ workedOn: '2026-11-30', hours: Number(typed) }))).toEqual([words]);
  });

  it.each([1e-308, Number.MIN_VALUE, -0.5])('refuses the tiny or negative number %s', (hours) => {
    expect(messages(timeEntrySchema.safeParse({ workedOn: '2026-11-30', hours }))).toEqual(['Hours must be more than 0']);
  });

  it('refuses text in the form that is not a plain decimal number', () => {
    for (const typed of ['abc', '1e1', '0x10', '-1', '']) {
      expect(timeEntryFormSchema.safeParse({ workedOn: '2026-11-30', hours: typed, note: '' }).success, typed).toBe(false);
    }
  });
});

describe('calendar days', () => {
  // ISO 8601 calendar dates; the Gregorian leap-year rule (divisible by 4, not by 100 unless by 400).
  it.each([
    ['2028-02-29', true],
    ['2026-02-29', false],
    ['2000-02-29', true],
    ['1900-02-29', false],
    ['2026-04-31', false],
    ['2026-12-31', true],
    ['26-12-31', false],
  ])('%s is a calendar day: %s', (day, expected) => expect(isCalendarDay(day)).toBe(expected));
});

describe('a builder: rate and week', () => {
  it('refuses a null, empty or zero hourly rate in the words the invitation form uses', () => {
    for (const hourlyRate of [null, '', '0', '0.00', '12.345', 'NaN', 85]) {
      expect(messages(updateTeamMemberSchema.safeParse({ hourlyRate })), String(hourlyRate)).toEqual([
        'Hourly rate must be an amount above 0 with at most two decimals, like 85.00',
      ]);
    }
  });

  it('reads a blank day in the form as a day off and a typed day by the API rule', () => {
    const form = teamMemberFormSchema.safeParse({
      level: 'master',
      hourlyRate: '95.00',
      active: true,
      hours: { '1': '7', '2': '6.5', '3': '', '4': '', '5': '', '6': '', '7': '' },
    });
    expect(form.success && form.data.hours).toEqual({ '1': 7, '2': 6.5, '3': 0, '4': 0, '5': 0, '6': 0, '7': 0 });
    const tooLong = teamMemberFormSchema.safeParse({
      level: 'master',
      hourlyRate: '95.00',
      active: true,
      hours: { '1': '25', '2': '', '3': '', '4': '', '5': '', '6': '', '7': '' },
    });
    expect(tooLong.error?.issues.map((i) => i.message)).toEqual(['Monday must be a number of hours from 0 to 24']);
    expect(messages(updateTeamMemberSchema.safeParse({ weeklyHours: { '1': 25 } }))).toEqual([
      'Monday must be a number of hours from 0 to 24',
    ]);
  });

  it('asks for at least one change', () => {
    expect(messages(updateTeamMemberSchema.safeParse({}))).toEqual([
      'Say what to change: the level, hourly rate, weekly hours or whether the builder is active',
    ]);
  });
});

describe('extras', () => {
  it('takes a positive amount with two decimals and refuses the rest in words', () => {
    expect(proposeExtraSchema.safeParse({ description: 'Deeper case', amount: '45.00', reason: 'Taller pedals' }).success).toBe(true);
    expect(messages(proposeExtraSchema.safeParse({ description: 'Deeper case', amount: '0.00', reason: 'Taller pedals' }))).toEqual([
      'Amount must be an amount above 0, like 45.00',
    ]);
    expect(messages(proposeExtraSchema.safeParse({ description: 'Deeper case', amount: 45, reason: 'Taller pedals' }))).toEqual([
      'Amount must be an amount above 0, like 45.00',
    ]);
  });
});

describe('a check that follows a failed format check never runs on the bad text', () => {
  it('answers a price written as words with words, not a DecimalError', async () => {
    const { publishPriceBookSchema } = await import('./price-book/schema');
    const { demoPriceBook } = await import('./price-book/demo-price-book');
    const book = structuredClone(demoPriceBook);
    book.levels[0].rateLow = 'abc';
    book.surfaces[0].price = 'twelve';
    const result = publishPriceBookSchema.safeParse({ book, notes: '' });
    expect(result.success).toBe(false);
    expect(messages(result).join('\n')).toMatch(/must be a decimal string such as "12.50"/);
  });
});

import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { addDays, isoWeekday, todayIn } from './calendar-days';
import { publicHolidaysBetween } from './public-holidays';
import {
  dayCapacity,
  earliestBenchDateFor,
  earliestStart,
  firstFreeDay,
  freeSlices,
  planBuild,
  shipByDate,
  toCentihours,
  type BenchCalendar,
  type HourSlice,
} from './scheduling';

// The demo shop's master builder: 7 h Monday to Thursday, 6 h on Friday, weekends off.
const fullWeek = { '1': 7, '2': 7, '3': 7, '4': 7, '5': 6 };
const usHolidays = publicHolidaysBetween('US', '2026-01-01', '2027-12-31');
const calendar = (over: Partial<BenchCalendar> = {}): BenchCalendar => ({
  weeklyHours: fullWeek,
  closures: [],
  holidayOn: (d) => usHolidays.get(d) ?? null,
  ...over,
});
const nothingTaken = () => [] as HourSlice[];

describe('calendar days', () => {
  it('numbers weekdays the ISO 8601 way (Monday = 1, Sunday = 7)', () => {
    // ISO 8601-1:2019 §4.3.2.2: Monday is day 1. 2026-11-30 is a Monday (checked on a printed calendar, from memory).
    expect(isoWeekday('2026-11-30')).toBe(1);
    expect(isoWeekday('2026-12-06')).toBe(7);
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
  });

  it("gives today on the shop's wall clock, asked again in each zone", () => {
    // IANA time zone database: New Zealand keeps daylight time (UTC+13) in December, Los Angeles
    // standard time (UTC−8) (from memory). 23:30 UTC on 2 December is already the 3rd in Auckland.
    const instant = new Date('2026-12-02T23:30:00Z');
    for (let i = 0; i < 2; i++) {
      expect(todayIn('Pacific/Auckland', instant)).toBe('2026-12-03');
      expect(todayIn('America/Los_Angeles', instant)).toBe('2026-12-02');
      expect(todayIn('UTC', instant)).toBe('2026-12-02');
    }
    expect(() => todayIn('Mars/Olympus_Mons', instant)).toThrow(RangeError);
  });
});

describe('public holidays from date-holidays (code ISC, holiday data CC-BY-3.0)', () => {
  it('closes US Thanksgiving and Christmas 2026 and nothing of a non-public type', () => {
    // 5 U.S.C. § 6103(a): Thanksgiving is the fourth Thursday in November, Christmas is December 25.
    const novemberThursdays = Array.from({ length: 30 }, (_, i) => `2026-11-${String(i + 1).padStart(2, '0')}`).filter(
      (d) => isoWeekday(d) === 4,
    );
    expect(novemberThursdays[3]).toBe('2026-11-26');
    expect(usHolidays.get('2026-11-26')).toBe('Thanksgiving Day');
    expect(usHolidays.get('2026-12-25')).toBe('Christmas Day');
    // The day after Thanksgiving is an 'observance' and Christmas Eve 'optional' in the dataset: the bench works.
    expect(usHolidays.has('2026-11-27')).toBe(false);
    expect(usHolidays.has('2026-12-24')).toBe(false);
  });

  it('follows the shop country: Boxing Day closes a UK shop, not a US one', () => {
    // Banking and Financial Dealings Act 1971, Schedule 1: 26 December is a bank holiday in England and Wales.
    const gb = publicHolidaysBetween('GB', '2026-12-01', '2026-12-31');
    expect(gb.has('2026-12-28') || gb.has('2026-12-26')).toBe(true);
    expect(usHolidays.has('2026-12-26')).toBe(false);
  });
});

describe('day capacity', () => {
  it('takes the weekday hours, and zero on days off, holidays and closures', () => {
    const cal = calendar({ closures: [{ startsOn: '2026-12-14', endsOn: '2026-12-15', reason: 'stocktake' }] });
    expect(dayCapacity('2026-12-07', cal)).toEqual({ capacity: 700, off: null });
    expect(dayCapacity('2026-12-11', cal)).toEqual({ capacity: 600, off: null });
    expect(dayCapacity('2026-12-12', cal).off).toEqual({ kind: 'day_off', label: 'Day off' });
    expect(dayCapacity('2026-11-26', cal)).toEqual({ capacity: 0, off: { kind: 'holiday', label: 'Thanksgiving Day' } });
    expect(dayCapacity('2026-12-15', cal)).toEqual({ capacity: 0, off: { kind: 'closure', label: 'Shop closed: stocktake' } });
    expect(dayCapacity('2026-12-16', cal).capacity).toBe(700);
  });
});

describe('free hours of a day', () => {
  it('leaves the gaps between slices already taken', () => {
    expect(freeSlices(700, [])).toEqual([{ from: 0, to: 700 }]);
    expect(
      freeSlices(700, [
        { from: 150, to: 300 },
        { from: 0, to: 100 },
      ]),
    ).toEqual([
      { from: 100, to: 150 },
      { from: 300, to: 700 },
    ]);
    expect(freeSlices(700, [{ from: 0, to: 700 }])).toEqual([]);
    // A slice booked when the day was longer never yields negative or out-of-day free time.
    expect(freeSlices(600, [{ from: 0, to: 650 }])).toEqual([]);
  });
});

describe('laying a build on the bench', () => {
  it('fills partial days: 10 h from a Monday is 7 h Monday and 3 h Tuesday', () => {
    const plan = planBuild({ laborHours: toCentihours('10'), benchDate: '2026-12-07', calendar: calendar(), taken: nothingTaken });
    expect(plan).toMatchObject({ ok: true, expectedCompletion: '2026-12-08' });
    if (!plan.ok) throw new Error('expected a plan');
    expect(plan.days.map((d) => [d.day, d.hours])).toEqual([
      ['2026-12-07', 700],
      ['2026-12-08', 300],
    ]);
  });

  it('uses only the free hours of a day that is partly booked', () => {
    const taken = (d: string) => (d === '2026-12-07' ? [{ from: 0, to: 400 }] : []);
    const plan = planBuild({ laborHours: toCentihours('5.5'), benchDate: '2026-12-07', calendar: calendar(), taken });
    if (!plan.ok) throw new Error('expected a plan');
    expect(plan.days).toEqual([
      { day: '2026-12-07', slices: [{ from: 400, to: 700 }], hours: 300 },
      { day: '2026-12-08', slices: [{ from: 0, to: 250 }], hours: 250 },
    ]);
  });

  it('runs a 40 h build past the weekend into the next week (34 h a week)', () => {
    const plan = planBuild({ laborHours: 4000, benchDate: '2026-12-07', calendar: calendar(), taken: nothingTaken });
    if (!plan.ok) throw new Error('expected a plan');
    expect(plan.days.map((d) => d.day)).toEqual(['2026-12-07', '2026-12-08', '2026-12-09', '2026-12-10', '2026-12-11', '2026-12-14']);
    expect(plan.days.reduce((s, d) => s + d.hours, 0)).toBe(4000);
    expect(plan.expectedCompletion).toBe('2026-12-14');
  });

  it('skips Thanksgiving: 14 h from Wednesday 25 Nov is Wed 7 h, Fri 6 h, Mon 1 h', () => {
    const plan = planBuild({ laborHours: 1400, benchDate: '2026-11-25', calendar: calendar(), taken: nothingTaken });
    if (!plan.ok) throw new Error('expected a plan');
    expect(plan.days.map((d) => [d.day, d.hours])).toEqual([
      ['2026-11-25', 700],
      ['2026-11-27', 600],
      ['2026-11-30', 100],
    ]);
  });

  it('refuses a bench date with no free time, and a date that is a holiday', () => {
    const full = (d: string) => (d === '2026-12-07' ? [{ from: 0, to: 700 }] : []);
    expect(planBuild({ laborHours: 100, benchDate: '2026-12-07', calendar: calendar(), taken: full })).toMatchObject({
      ok: false,
      reason: 'bench_date_full',
    });
    expect(planBuild({ laborHours: 100, benchDate: '2026-12-25', calendar: calendar(), taken: nothingTaken })).toMatchObject({
      ok: false,
      reason: 'bench_date_full',
    });
  });

  it('says so when a builder has no working hours at all', () => {
    const plan = earliestStart({ laborHours: 100, from: '2026-12-07', calendar: calendar({ weeklyHours: {} }), taken: nothingTaken });
    expect(plan).toMatchObject({ ok: false, reason: 'no_capacity' });
  });

  it('suggests the first day with free time after full days and the Christmas holiday', () => {
    const taken = (d: string) => (d === '2026-12-23' || d === '2026-12-24' ? [{ from: 0, to: 700 }] : []);
    const plan = earliestStart({ laborHours: 800, from: '2026-12-23', calendar: calendar(), taken });
    if (!plan.ok) throw new Error('expected a plan');
    // 25 Dec is Christmas, 26–27 the weekend: the build starts Monday 28 Dec and ends Tuesday.
    expect(plan.benchDate).toBe('2026-12-28');
    expect(plan.expectedCompletion).toBe('2026-12-29');
  });

  it('finds that first free day whatever the build’s hours, so one search serves every build on the same bench', () => {
    const taken = (d: string) => (d === '2026-12-23' || d === '2026-12-24' ? [{ from: 0, to: 700 }] : []);
    const startsOn = firstFreeDay({ from: '2026-12-23', calendar: calendar(), taken });
    expect(startsOn).toBe('2026-12-28');
    for (const laborHours of [25, 700, 800, 4000]) {
      const input = { laborHours, from: '2026-12-23', calendar: calendar(), taken };
      expect(earliestStart({ ...input, startsOn })).toEqual(earliestStart(input));
    }
    // No working hours at all: no free day within the horizon, and the same refusal either way.
    const none = { from: '2026-12-23', calendar: calendar({ weeklyHours: {} }), taken: nothingTaken };
    expect(firstFreeDay(none)).toBeNull();
    expect(earliestStart({ ...none, laborHours: 100, startsOn: null })).toEqual(earliestStart({ ...none, laborHours: 100 }));
  });
});

describe('ship-by day', () => {
  it('counts three shop working days back, skipping a holiday and the weekend', () => {
    // Bench Mon 30 Nov: Fri 27, (Thu 26 Thanksgiving), Wed 25, Tue 24.
    expect(shipByDate('2026-11-30', calendar())).toBe('2026-11-24');
    expect(shipByDate('2026-12-10', calendar())).toBe('2026-12-07');
  });

  it('never suggests a bench date the player cannot ship in time for', () => {
    const today = '2026-12-01';
    const first = earliestBenchDateFor(today, calendar());
    expect(shipByDate(first, calendar()) >= today).toBe(true);
    expect(shipByDate(addDays(first, -1), calendar()) < today).toBe(true);
  });
});

describe('hours as centihours', () => {
  // decimal.js (the reference library the whole price book rounds with) is the oracle: hundredths
  // of an hour, rounded half up, for every form the bench reads (numeric text from PostgreSQL,
  // numbers from weekly hours) and for text with more decimals than the fast path reads.
  const byDecimal = (hours: string | number) => new Decimal(hours).times(100).round().toNumber();

  it('gives what decimal.js gives for two-decimal text, numbers, and odd forms', () => {
    const samples: Array<string | number> = [
      '0',
      '0.00',
      '7',
      '7.5',
      '7.50',
      '0.25',
      '0.29',
      '1.05',
      '23.99',
      '24.00',
      '-1.25',
      '-0.00',
      '007.10',
    ];
    samples.push('1.005', '0.125', '2.675', '1e2', '.5', '3.14159', 0.1 + 0.2, 7.5, 6, 0.29, 1.15, -2.5);
    for (let centi = 0; centi <= 2_400; centi++) samples.push((centi / 100).toFixed(2), centi / 100, String(centi / 100));
    for (const hours of samples) expect(toCentihours(hours), String(hours)).toBe(byDecimal(hours));
  });

  it('refuses what is not a number, as decimal.js does', () => {
    expect(() => toCentihours('seven')).toThrow();
    expect(() => toCentihours('')).toThrow();
  });
});

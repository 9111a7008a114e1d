import Decimal from 'decimal.js';
import type { BenchDayOff, WeeklyHours } from '@loomwright/shared';
import { addDays, isoWeekday } from './calendar-days';

/**
 * The bench rules, pure: what a builder can work on a day, and where a build's hours go.
 *
 * Hours are held as integer hundredths ("centihours") so 0.25 h slices add up exactly; the
 * database keeps the same slices as numrange values with two decimals.
 */
export type Centihours = number;

export interface HourSlice {
  /** [from, to) within the day, in centihours from the start of the builder's day. */
  from: Centihours;
  to: Centihours;
}

export interface Closure {
  startsOn: string;
  endsOn: string;
  reason: string;
}

/** Everything that decides a builder's capacity on a given day. */
export interface BenchCalendar {
  weeklyHours: WeeklyHours;
  closures: Closure[];
  /** The public holiday's name on that day, or null. */
  holidayOn: (day: string) => string | null;
  /** The builder's own days away (ill, holiday, a course); the shop stays open. */
  absences?: Closure[];
}

export interface DayCapacity {
  capacity: Centihours;
  off: BenchDayOff;
}

// Hours written with at most two decimals ("7", "3.50", 7.5): their hundredths exactly, without a decimal.js object.
const TWO_DECIMALS = /^(-?)(\d{1,12})(?:\.(\d{1,2}))?$/;

/**
 * Hours as centihours, rounded half up. Hours with at most two decimals (every bench slice, weekly
 * hours and labor hours the database or the schemas hold) are read as integers; anything else goes
 * through decimal.js, which rounds the same way. The planner converts each slice and day it reads,
 * so this runs thousands of times per lead time.
 */
export function toCentihours(hours: string | number): Centihours {
  const m = TWO_DECIMALS.exec(typeof hours === 'number' ? String(hours) : hours);
  if (!m) return new Decimal(hours).times(100).round().toNumber();
  const value = Number(m[2]) * 100 + Number((m[3] ?? '').padEnd(2, '0'));
  return m[1] ? -value : value;
}
export const toHours = (centihours: Centihours): number => centihours / 100;

/** Holidays and closures first (the shop is shut), then the builder's own week. */
export function dayCapacity(day: string, calendar: BenchCalendar): DayCapacity {
  const holiday = calendar.holidayOn(day);
  if (holiday) return { capacity: 0, off: { kind: 'holiday', label: holiday } };
  const closure = calendar.closures.find((c) => c.startsOn <= day && day <= c.endsOn);
  if (closure) return { capacity: 0, off: { kind: 'closure', label: `Shop closed: ${closure.reason}` } };
  const absence = calendar.absences?.find((a) => a.startsOn <= day && day <= a.endsOn);
  if (absence) return { capacity: 0, off: { kind: 'absence', label: `Away: ${absence.reason}` } };
  const hours = calendar.weeklyHours[String(isoWeekday(day)) as keyof WeeklyHours] ?? 0;
  const capacity = Math.max(0, Math.min(2400, toCentihours(hours)));
  return capacity === 0 ? { capacity: 0, off: { kind: 'day_off', label: 'Day off' } } : { capacity, off: null };
}

/** The free gaps of a day of `capacity`, given the slices already taken (in any order). */
export function freeSlices(capacity: Centihours, taken: HourSlice[]): HourSlice[] {
  const sorted = [...taken].sort((a, b) => a.from - b.from);
  const gaps: HourSlice[] = [];
  let cursor = 0;
  for (const slice of sorted) {
    if (slice.from > cursor) gaps.push({ from: cursor, to: Math.min(slice.from, capacity) });
    cursor = Math.max(cursor, slice.to);
    if (cursor >= capacity) break;
  }
  if (cursor < capacity) gaps.push({ from: cursor, to: capacity });
  return gaps.filter((g) => g.to > g.from);
}

export const sliceLength = (s: HourSlice): Centihours => s.to - s.from;
export const totalOf = (slices: HourSlice[]): Centihours => slices.reduce((sum, s) => sum + sliceLength(s), 0);

export interface PlannedDay {
  day: string;
  slices: HourSlice[];
  hours: Centihours;
}

export type BuildPlan =
  | { ok: true; days: PlannedDay[]; benchDate: string; expectedCompletion: string }
  | { ok: false; reason: 'bench_date_full' | 'no_capacity'; message: string };

/** How far ahead a plan may run before we say the builder has no bench time at all. */
export const PLANNING_HORIZON_DAYS = 730;

/**
 * Lays a build of `laborHours` on the bench from `benchDate` on: it takes each working day's free
 * hours in order (partial days allowed), across weeks if it must, and completes on the last day
 * it uses. The build has to start on its bench date, so that day needs some free time.
 */
export function planBuild(input: {
  laborHours: Centihours;
  benchDate: string;
  calendar: BenchCalendar;
  taken: (day: string) => HourSlice[];
}): BuildPlan {
  const { laborHours, benchDate, calendar, taken } = input;
  let remaining = laborHours;
  const days: PlannedDay[] = [];
  for (let i = 0; i < PLANNING_HORIZON_DAYS && remaining > 0; i++) {
    const day = addDays(benchDate, i);
    const { capacity } = dayCapacity(day, calendar);
    const free = capacity > 0 ? freeSlices(capacity, taken(day)) : [];
    if (i === 0 && totalOf(free) === 0) {
      return { ok: false, reason: 'bench_date_full', message: `There is no free bench time on ${benchDate}; pick another date.` };
    }
    const used: HourSlice[] = [];
    for (const gap of free) {
      if (remaining === 0) break;
      const take = Math.min(remaining, sliceLength(gap));
      used.push({ from: gap.from, to: gap.from + take });
      remaining -= take;
    }
    if (used.length) days.push({ day, slices: used, hours: totalOf(used) });
  }
  if (remaining > 0 || days.length === 0) {
    return {
      ok: false,
      reason: 'no_capacity',
      message: 'This builder has no bench time in the next two years; check their working hours.',
    };
  }
  return { ok: true, days, benchDate, expectedCompletion: days[days.length - 1].day };
}

const NO_CAPACITY: BuildPlan = {
  ok: false,
  reason: 'no_capacity',
  message: 'This builder has no bench time in the next two years; check their working hours.',
};

/**
 * The first day on or after `from` with some free bench time, or null within the planning horizon.
 * It does not depend on the build's hours, so one answer serves every build planned on the same bench.
 */
export function firstFreeDay(input: { from: string; calendar: BenchCalendar; taken: (day: string) => HourSlice[] }): string | null {
  for (let i = 0; i < PLANNING_HORIZON_DAYS; i++) {
    const day = addDays(input.from, i);
    const { capacity } = dayCapacity(day, input.calendar);
    if (capacity === 0 || totalOf(freeSlices(capacity, input.taken(day))) === 0) continue;
    return day;
  }
  return null;
}

/**
 * The earliest day on or after `from` on which the build can start, with its plan. `startsOn`, when
 * known, is `firstFreeDay` for the same `from`, calendar and bench.
 */
export function earliestStart(input: {
  laborHours: Centihours;
  from: string;
  calendar: BenchCalendar;
  taken: (day: string) => HourSlice[];
  startsOn?: string | null;
}): BuildPlan {
  const day = input.startsOn === undefined ? firstFreeDay(input) : input.startsOn;
  return day === null ? NO_CAPACITY : planBuild({ ...input, benchDate: day });
}

/**
 * A shop working day: Monday to Friday, not a public holiday or closure. Carriers and the shop's
 * receiving desk work these days, whatever a builder's own bench week looks like.
 */
export function isShopWorkingDay(day: string, calendar: Pick<BenchCalendar, 'closures' | 'holidayOn'>): boolean {
  if (isoWeekday(day) > 5) return false;
  if (calendar.holidayOn(day)) return false;
  return !calendar.closures.some((c) => c.startsOn <= day && day <= c.endsOn);
}

/**
 * The day the pedals should be shipped or dropped off: `workingDays` shop working days before the
 * bench date, so a parcel in transit and its intake check land before the build starts
 * (common practice, no published source; three days is our default).
 */
export const SHIP_LEAD_WORKING_DAYS = 3;

export function shipByDate(
  benchDate: string,
  calendar: Pick<BenchCalendar, 'closures' | 'holidayOn'>,
  workingDays = SHIP_LEAD_WORKING_DAYS,
): string {
  let day = benchDate;
  let counted = 0;
  while (counted < workingDays) {
    day = addDays(day, -1);
    if (isShopWorkingDay(day, calendar)) counted++;
  }
  return day;
}

/** The first bench date whose ship-by day is not before today: the player still has time to ship. */
export function earliestBenchDateFor(today: string, calendar: Pick<BenchCalendar, 'closures' | 'holidayOn'>): string {
  let day = addDays(today, 1);
  while (shipByDate(day, calendar) < today) day = addDays(day, 1);
  return day;
}

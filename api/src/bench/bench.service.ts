import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import {
  errorResponse,
  levelRank,
  type AuthUser,
  type BenchBuilder,
  type BenchDay,
  type BenchDateRefusal,
  type BenchLeadTime,
  type BenchPreview,
  type BenchPreviewOption,
  type BenchSuggestResponse,
  type BenchSuggestion,
  type BenchView,
  type BuilderLevel,
  type WeeklyHours,
} from '@loomwright/shared';
import { Database, type Executor } from '../database/database';
import { firmQuoteFigures } from '../builds/firm-quote';
import { formatDay as formatDayWords } from '../mail/templates/format';
import { BenchCache, type BenchSnapshot, type HeldSlice } from './bench-cache';
import { BenchRepository } from './bench.repository';
import { addDays, daysBetween, eachDay, todayIn } from './calendar-days';
import { publicHolidaysBetween } from './public-holidays';
import {
  dayCapacity,
  earliestBenchDateFor,
  earliestStart,
  firstFreeDay,
  planBuild,
  shipByDate,
  toCentihours,
  toHours,
  type BenchCalendar,
  type BuildPlan,
  type Closure,
  type HourSlice,
} from './scheduling';

export const MAX_BENCH_VIEW_DAYS = 93;

/**
 * Days a player's request usually waits between paying and a builder accepting it, before the
 * shipping lead starts to count (common practice, no published source).
 */
export const ACCEPTANCE_ALLOWANCE_DAYS = 2;

/** Lead-time answers kept per snapshot of the bench (hours and level asked), before they are all forgotten. */
const LEAD_TIMES_HELD = 1_000;

type BuilderRow = Awaited<ReturnType<BenchRepository['listBuilders']>>[number];

/** What the firm quote and the planner need to know about a booking's estimate. */
/** The shop's calendar as every plan sees it: closures, holidays, each builder's days away. */
export interface ShopCalendar {
  closures: Closure[];
  holidayOn: (d: string) => string | null;
  absences: Map<string, Closure[]>;
  today: string;
  /** The shop's time zone, which decides what today is. */
  timezone: string;
  currency: string;
}

/** States in which a build still waits for its pedals: its ship-by day must not be in the past. */
export const AWAITING_PEDALS = ['requested', 'deposit_paid', 'scheduled'];

export interface PlanningFacts {
  bookingId: string;
  reference: string;
  state: string;
  customerId: string;
  customerName: string;
  customerEmail: string;
  laborHours: string;
  minimumLevel: BuilderLevel;
  /** The level the player chose, raised to the rig's minimum: builders below it need the owner and a reason. */
  chosenLevel: BuilderLevel;
  /** The high end of the estimate the player was quoted; a firm total above it needs their consent. */
  quotedHigh: string;
  benchDate: string | null;
  builderId: string | null;
  materialsTotal: string;
  deposit: string;
  currency: string;
  estimateQuote: NonNullable<Awaited<ReturnType<BenchRepository['latestEstimateQuote']>>>;
  configuration: NonNullable<Awaited<ReturnType<BenchRepository['findBookingForPlanning']>>>['configuration'];
}

@Injectable()
export class BenchService {
  private readonly holidayYears = new Map<string, Map<string, string>>();

  constructor(
    private readonly db: Database,
    private readonly bench: BenchRepository,
    private readonly cache: BenchCache,
  ) {}

  /** Public holidays by day, cached per country and year (the dataset does not change at runtime). */
  holidayOn(countryCode: string): (day: string) => string | null {
    return (day: string) => {
      const key = `${countryCode}:${day.slice(0, 4)}`;
      let year = this.holidayYears.get(key);
      if (!year) {
        year = publicHolidaysBetween(countryCode, `${day.slice(0, 4)}-01-01`, `${day.slice(0, 4)}-12-31`);
        this.holidayYears.set(key, year);
      }
      return year.get(day) ?? null;
    };
  }

  async shopCalendar(trx: Executor = this.db): Promise<ShopCalendar> {
    const { settings, closures, absences: absenceRows, worked_holidays } = await this.bench.calendarFacts(trx);
    const country = settings?.country_code.trim() ?? 'US';
    // Public holidays the owner switched off one by one are ordinary working days.
    const worked = new Set(worked_holidays.map((h) => h.day));
    const holidayOn = this.holidayOn(country);
    const absences = new Map<string, Closure[]>();
    for (const a of absenceRows) {
      const list = absences.get(a.builder_id) ?? [];
      list.push({ startsOn: a.starts_on, endsOn: a.ends_on, reason: a.reason });
      absences.set(a.builder_id, list);
    }
    return {
      absences,
      closures: closures.map((c) => ({ startsOn: c.starts_on, endsOn: c.ends_on, reason: c.reason })),
      holidayOn: (day: string) => (worked.has(day) ? null : holidayOn(day)),
      today: todayIn(settings?.timezone ?? 'UTC'),
      timezone: settings?.timezone ?? 'UTC',
      currency: settings?.currency.trim() ?? 'USD',
    };
  }

  /** One builder's calendar: their week, the shop's closures and holidays, their own days away. */
  calendarOf(
    builder: { id: string; weekly_hours: WeeklyHours },
    shop: Pick<ShopCalendar, 'closures' | 'holidayOn' | 'absences'>,
  ): BenchCalendar {
    return {
      weeklyHours: builder.weekly_hours,
      closures: shop.closures,
      holidayOn: shop.holidayOn,
      absences: shop.absences.get(builder.id) ?? [],
    };
  }

  async view(user: AuthUser, query: { from?: string; to?: string; builderId?: string }): Promise<BenchView> {
    const shop = await this.shopCalendar();
    const from = query.from ?? shop.today;
    const to = query.to ?? addDays(from, 13);
    const span = daysBetween(from, to);
    if (span < 0) throw new BadRequestException('The last day shown must be on or after the first day shown.');
    if (span >= MAX_BENCH_VIEW_DAYS)
      throw new BadRequestException(`Ask for at most ${MAX_BENCH_VIEW_DAYS} days of bench at a time (from and to).`);
    // Someone still invited (no password yet) takes no builds, so has no row on the bench.
    const builders = this.orderMeFirst(
      (await this.bench.listBuilders(this.db, { builderId: query.builderId })).filter((b) => b.joined),
      user,
    );
    if (query.builderId && builders.length === 0)
      throw new NotFoundException('That builder has not joined the team; choose one from the list.');
    const ids = builders.map((b) => b.id);
    const [slices, recorded] = await Promise.all([
      this.bench.allocationsBetween(this.db, ids, from, to),
      this.bench.recordedHoursBetween(this.db, ids, from, to),
    ]);
    const days = eachDay(from, to);
    return {
      from,
      to,
      builders: builders.map((b) => {
        const calendar = this.calendarOf(b, shop);
        return {
          builder: this.toBenchBuilder(b, user),
          days: days.map((day): BenchDay => {
            const { capacity, off } = dayCapacity(day, calendar);
            const mine = slices.filter((s) => s.builder_id === b.id && s.day === day);
            const byBooking = new Map<string, BenchDay['builds'][number]>();
            let booked = 0;
            for (const s of mine) {
              const length = toCentihours(s.upper) - toCentihours(s.lower);
              booked += length;
              const entry = byBooking.get(s.booking_id) ?? {
                bookingId: s.booking_id,
                reference: s.reference,
                customerName: s.customer_name,
                state: s.state,
                hours: 0,
                benchDate: s.bench_date,
              };
              entry.hours = toHours(toCentihours(entry.hours) + length);
              byBooking.set(s.booking_id, entry);
            }
            return {
              date: day,
              capacityHours: toHours(capacity),
              bookedHours: toHours(booked),
              freeHours: toHours(Math.max(0, capacity - booked)),
              recordedHours: Number(recorded.find((r) => r.builder_id === b.id && r.worked_on === day)?.hours ?? 0),
              off,
              builds: [...byBooking.values()],
            };
          }),
        };
      }),
    };
  }

  /**
   * The earliest start per builder for a request (or for a scheduled build being moved, planned as
   * if its own hours were free). Builders of the level the player chose come first; below the
   * rig's minimum they are left out, and below the chosen level only the owner sees them.
   */
  async suggest(user: AuthUser, bookingId: string, builderId?: string): Promise<BenchSuggestResponse> {
    const [facts, bench] = await Promise.all([this.planningFacts(this.db, bookingId), this.heldBench()]);
    const moving = ['scheduled', 'pedals_received'].includes(facts.state);
    if (!['requested', 'deposit_paid'].includes(facts.state) && !moving) {
      throw new ConflictException(
        `Booking ${facts.reference} is ${facts.state.replace(/_/g, ' ')}; only a request waiting for a bench date, or a build not yet on the bench, gets a suggestion.`,
      );
    }
    const { shop } = bench;
    // As listBuilders with { builderId, activeOnly: !builderId }: one builder asked for, or every active one who has joined.
    const team = bench.team.filter((b) => (builderId ? b.id === builderId : b.active && b.joined));
    const builders = this.orderMeFirst(team, user);
    if (builderId && builders.length === 0) throw new NotFoundException('That builder is not on the team; choose one from the list.');
    // earliestAllowedDate on the held bench: the first shippable day is worked out once per snapshot.
    const from = AWAITING_PEDALS.includes(facts.state) ? (bench.firstShippable ??= earliestBenchDateFor(shop.today, shop)) : shop.today;
    const suggestions: BenchSuggestion[] = [];
    const ineligible: BenchSuggestResponse['ineligible'] = [];
    // Who is left out by level first, then every other builder planned from one read of the bench;
    // the answer keeps the builders' order.
    const levelReason = (b: (typeof builders)[number]): string | null => {
      if (builderId) return null;
      if (levelRank(b.level) < levelRank(facts.minimumLevel))
        return `This rig needs at least a ${facts.minimumLevel} builder; ${b.name} is ${b.level}.`;
      if (levelRank(b.level) < levelRank(facts.chosenLevel) && user.role !== 'owner')
        return `The player chose a ${facts.chosenLevel} builder; only the owner can give it to ${b.name} (${b.level}), with a reason the player reads.`;
      return null;
    };
    const planned = builders.filter((b) => levelReason(b) === null);
    const plans = this.earliestStartsOn(bench, planned, facts.laborHours, from, moving ? bookingId : undefined);
    const planOf = new Map(planned.map((b, i) => [b.id, plans[i]!]));
    for (const b of builders) {
      const meets = levelRank(b.level) >= levelRank(facts.minimumLevel);
      const meetsChosen = levelRank(b.level) >= levelRank(facts.chosenLevel);
      const plan = planOf.get(b.id);
      if (!plan) {
        ineligible.push({ builder: this.toRef(b), reason: levelReason(b)! });
        continue;
      }
      if (!plan.ok) {
        ineligible.push({ builder: this.toRef(b), reason: plan.message });
        continue;
      }
      const figures = firmQuoteFigures({
        hourlyRate: b.hourly_rate,
        laborHours: facts.laborHours,
        materialsTotal: facts.materialsTotal,
        deposit: facts.deposit,
      });
      suggestions.push({
        builder: this.toBenchBuilder(b, user),
        benchDate: plan.benchDate,
        expectedCompletion: plan.expectedCompletion,
        shipBy: this.shipByOn(bench, plan.benchDate),
        plan: plan.days.map((d) => ({ date: d.day, hours: toHours(d.hours) })),
        laborTotal: figures.laborTotal,
        firmTotal: figures.total,
        meetsMinimumLevel: meets,
        meetsChosenLevel: meetsChosen,
        aboveQuotedRange: new Decimal(figures.total).gt(facts.quotedHigh),
      });
    }
    // The chosen level first, then the earliest start; the signed-in builder wins a tie (the list is already "me first").
    suggestions.sort((a, b) => Number(b.meetsChosenLevel) - Number(a.meetsChosenLevel) || a.benchDate.localeCompare(b.benchDate));
    return {
      bookingId: facts.bookingId,
      reference: facts.reference,
      laborHours: Number(facts.laborHours),
      minimumLevel: facts.minimumLevel,
      chosenLevel: facts.chosenLevel,
      quotedHigh: facts.quotedHigh,
      currency: facts.currency,
      materialsTotal: facts.materialsTotal,
      deposit: facts.deposit,
      suggestions,
      ineligible,
    };
  }

  /**
   * The first bench date a build in `state` may take: while the pedals are still to come, the
   * first day whose ship-by day is not in the past; once they are in, today.
   */
  earliestAllowedDate(state: string, shop: Pick<ShopCalendar, 'today' | 'closures' | 'holidayOn'>): string {
    return AWAITING_PEDALS.includes(state) ? earliestBenchDateFor(shop.today, shop) : shop.today;
  }

  /**
   * Why `benchDate` cannot hold the build for this builder, or null when it can. Checked in the
   * order a person would explain it: the past, the shipping lead, the day itself, then its load.
   */
  refusalFor(
    state: string,
    benchDate: string,
    calendar: BenchCalendar,
    shop: Pick<ShopCalendar, 'today' | 'closures' | 'holidayOn'>,
    plan: BuildPlan,
  ): { refusal: BenchDateRefusal; message: string } | null {
    if (benchDate < shop.today)
      return { refusal: 'past', message: `benchDate ${benchDate} is in the past; the shop's today is ${shop.today}.` };
    if (AWAITING_PEDALS.includes(state)) {
      const shipBy = shipByDate(benchDate, shop);
      if (shipBy < shop.today) {
        return {
          refusal: 'too_soon_to_ship',
          message: `Too soon to ship: the pedals would have to arrive by ${formatDayWords(shipBy)}, which has passed. The earliest bench date the player can ship for is ${formatDayWords(earliestBenchDateFor(shop.today, shop))}.`,
        };
      }
    }
    const { off } = dayCapacity(benchDate, calendar);
    if (off) {
      const kind: Record<NonNullable<typeof off>['kind'], BenchDateRefusal> = {
        holiday: 'holiday',
        closure: 'closed',
        day_off: 'day_off',
        absence: 'away',
      };
      const why = off.kind === 'holiday' ? `public holiday (${off.label})` : off.label;
      return { refusal: kind[off.kind], message: `There is no free bench time on ${formatDayWords(benchDate)}: ${why}.` };
    }
    if (!plan.ok) {
      const full = plan.reason === 'bench_date_full';
      return {
        refusal: full ? 'full' : 'no_capacity',
        message: full ? `There is no free bench time on ${formatDayWords(benchDate)}: the day is full; pick another date.` : plan.message,
      };
    }
    return null;
  }

  /** As refusalFor, thrown: a date in the past or too soon to ship is a bad request, a full or closed day a conflict. */
  assertBenchDate(
    state: string,
    benchDate: string,
    calendar: BenchCalendar,
    shop: Pick<ShopCalendar, 'today' | 'closures' | 'holidayOn'>,
    plan: BuildPlan,
  ): asserts plan is Extract<BuildPlan, { ok: true }> {
    const refused = this.refusalFor(state, benchDate, calendar, shop, plan);
    if (!refused) return;
    if (refused.refusal === 'past') throw new BadRequestException(errorResponse('bench_date_in_past', refused.message));
    if (refused.refusal === 'too_soon_to_ship') throw new BadRequestException(errorResponse('too_soon_to_ship', refused.message));
    const full = refused.refusal === 'full' || refused.refusal === 'no_capacity';
    throw new ConflictException(errorResponse(full ? 'bench_day_full' : 'bench_day_closed', refused.message));
  }

  /**
   * What choosing `benchDate` would mean for each builder (or one), before anything is submitted:
   * their load on the days the build would take, the ship-by day, the price, and why not.
   */
  async preview(user: AuthUser, query: { bookingId: string; benchDate: string; builderId?: string }): Promise<BenchPreview> {
    const facts = await this.planningFacts(this.db, query.bookingId);
    if (!['requested', 'deposit_paid', 'scheduled', 'pedals_received'].includes(facts.state)) {
      throw new ConflictException(`Booking ${facts.reference} is ${facts.state.replace(/_/g, ' ')}; its bench date can no longer change.`);
    }
    const moving = ['scheduled', 'pedals_received'].includes(facts.state);
    const shop = await this.shopCalendar();
    const builders = this.orderMeFirst(
      await this.bench.listBuilders(this.db, { builderId: query.builderId, activeOnly: !query.builderId }),
      user,
    );
    if (query.builderId && builders.length === 0) throw new NotFoundException('That builder is not on the team; choose one from the list.');
    const minDate = this.earliestAllowedDate(facts.state, shop);
    const options: BenchPreviewOption[] = [];
    for (const b of builders) {
      const calendar = this.calendarOf(b, shop);
      const except = moving ? query.bookingId : undefined;
      const plan = await this.planFor(this.db, b, facts.laborHours, shop, { benchDate: query.benchDate }, except);
      const refused = this.refusalFor(facts.state, query.benchDate, calendar, shop, plan);
      const next = await this.planFor(
        this.db,
        b,
        facts.laborHours,
        shop,
        { from: query.benchDate < minDate ? minDate : query.benchDate },
        except,
      );
      const days = plan.ok && !refused ? plan.days.map((d) => d.day) : [query.benchDate];
      const slices = await this.bench.allocationsBetween(this.db, [b.id], days[0], days[days.length - 1]);
      const figures = firmQuoteFigures({
        hourlyRate: b.hourly_rate,
        laborHours: facts.laborHours,
        materialsTotal: facts.materialsTotal,
        deposit: facts.deposit,
      });
      options.push({
        builder: this.toBenchBuilder(b, user),
        ok: !refused,
        refusal: refused?.refusal ?? null,
        message: refused?.message ?? null,
        load: days.map((day) => {
          const { capacity, off } = dayCapacity(day, calendar);
          const others = slices.filter((sl) => sl.day === day && sl.booking_id !== except);
          const booked = others.reduce((sum, sl) => sum + toCentihours(sl.upper) - toCentihours(sl.lower), 0);
          const mine = plan.ok && !refused ? (plan.days.find((d) => d.day === day)?.hours ?? 0) : 0;
          return { date: day, capacityHours: toHours(capacity), bookedHours: toHours(booked), thisBuildHours: toHours(mine), off };
        }),
        expectedCompletion: plan.ok && !refused ? plan.expectedCompletion : null,
        shipBy: shipByDate(query.benchDate, shop),
        firmTotal: figures.total,
        meetsChosenLevel: levelRank(b.level) >= levelRank(facts.chosenLevel),
        aboveQuotedRange: new Decimal(figures.total).gt(facts.quotedHigh),
        nextPossibleDate: next.ok ? next.benchDate : null,
      });
    }
    return {
      bookingId: facts.bookingId,
      reference: facts.reference,
      benchDate: query.benchDate,
      today: shop.today,
      earliestShippableDate: earliestBenchDateFor(shop.today, shop),
      currentBenchDate: facts.benchDate,
      options,
    };
  }

  /**
   * The earliest start any active builder of at least `level` could give a build of `laborHours`,
   * by the same search a builder's acceptance makes, so the date a player sees is one the shop can
   * hold (it is not reserved until a builder accepts the paid request, which is then offered this
   * date or an earlier one).
   */
  async leadTime(laborHours: string, level: BuilderLevel): Promise<BenchLeadTime> {
    const bench = await this.heldBench();
    // The answer depends on nothing else than the bench and the shop's day, which the snapshot is of.
    const key = `${laborHours} ${level}`;
    let answer = bench.leadTimes.get(key);
    if (!answer) {
      answer = this.leadTimeOn(bench, laborHours, level);
      if (bench.leadTimes.size >= LEAD_TIMES_HELD) bench.leadTimes.clear();
      bench.leadTimes.set(key, answer);
    }
    return { ...answer };
  }

  private leadTimeOn(bench: BenchSnapshot, laborHours: string, level: BuilderLevel): BenchLeadTime {
    const { shop } = bench;
    // The player has yet to pay and a builder to accept, so the ship-by day is counted from a
    // couple of days ahead, never from today.
    const from = earliestBenchDateFor(addDays(shop.today, ACCEPTANCE_ALLOWANCE_DAYS), shop);
    // Every active builder who has joined (listBuilders' activeOnly), of the level or above.
    const builders = bench.team.filter((b) => b.active && b.joined && levelRank(b.level) >= levelRank(level));
    const plans = this.earliestStartsOn(bench, builders, laborHours, from);
    let best: { benchDate: string; expectedCompletion: string } | null = null;
    for (const plan of plans) {
      if (!plan.ok) continue;
      const earlier =
        !best ||
        plan.benchDate < best.benchDate ||
        (plan.benchDate === best.benchDate && plan.expectedCompletion < best.expectedCompletion);
      if (earlier) best = { benchDate: plan.benchDate, expectedCompletion: plan.expectedCompletion };
    }
    if (!best) {
      return {
        laborHours,
        level,
        earliestBenchDate: null,
        expectedCompletion: null,
        shipBy: null,
        message: `No ${level} builder has bench time free for this build right now; the shop will write to you with a date after you request it.`,
      };
    }
    return {
      laborHours,
      level,
      earliestBenchDate: best.benchDate,
      expectedCompletion: best.expectedCompletion,
      shipBy: this.shipByOn(bench, best.benchDate),
    };
  }

  /**
   * Plans a build for one builder against the bench as this executor sees it. Inside a transaction
   * that holds the builder's lock, that view is current. A build being moved leaves its own slices
   * out (`exceptBookingId`), since they are released in the same transaction.
   */
  async planFor(
    trx: Executor,
    builder: { id: string; weekly_hours: WeeklyHours },
    laborHours: string,
    shop: Pick<ShopCalendar, 'closures' | 'holidayOn' | 'absences'>,
    at: { from: string } | { benchDate: string },
    exceptBookingId?: string,
  ): Promise<BuildPlan> {
    const start = 'from' in at ? at.from : at.benchDate;
    const rows = await this.bench.allocationsFrom(trx, builder.id, start, exceptBookingId);
    return this.planOver(rows, builder, laborHours, shop, at);
  }

  /**
   * The bench as the lead time and the suggestions read it: from memory while this process hears
   * every change to it (BenchCache), read again once the shop's day has turned.
   */
  async heldBench(): Promise<BenchSnapshot> {
    const held = await this.cache.get(() => this.readBench());
    if (held.shop.today === todayIn(held.shop.timezone)) return held;
    this.cache.invalidate();
    return this.cache.get(() => this.readBench());
  }

  /**
   * The calendar, the whole team and every slice from yesterday (UTC) on, in three statements side
   * by side: the shop's today is yesterday, today or tomorrow in UTC whatever its time zone, so
   * every slice a plan from the shop's today can meet is there.
   */
  private async readBench(): Promise<BenchSnapshot> {
    const [shop, team, rows] = await Promise.all([
      this.shopCalendar(),
      this.bench.listBuilders(this.db),
      this.bench.allocationsFromDay(this.db, addDays(todayIn('UTC'), -1)),
    ]);
    const slices = new Map<string, Map<string, HeldSlice[]>>();
    for (const r of rows) {
      let days = slices.get(r.builder_id);
      if (!days) slices.set(r.builder_id, (days = new Map()));
      let list = days.get(r.day);
      if (!list) days.set(r.day, (list = []));
      list.push({ from: r.from_centihours, to: r.to_centihours, bookingId: r.booking_id });
    }
    return { shop, team, slices, leadTimes: new Map(), firstFreeDays: new Map(), shipBy: new Map() };
  }

  /**
   * The earliest start of each builder on or after `from` (not before the snapshot's today), on the
   * bench held in memory; a build being moved leaves its own slices out. Answers in the builders' order.
   */
  earliestStartsOn(
    bench: BenchSnapshot,
    builders: ReadonlyArray<{ id: string; weekly_hours: WeeklyHours }>,
    laborHours: string,
    from: string,
    exceptBookingId?: string,
  ): BuildPlan[] {
    return builders.map((b) => {
      const days = bench.slices.get(b.id);
      const taken = (d: string): HourSlice[] => {
        const list = days?.get(d);
        if (!list) return [];
        return exceptBookingId ? list.filter((s) => s.bookingId !== exceptBookingId) : list;
      };
      const calendar = this.calendarOf(b, bench.shop);
      // Most of the work is walking to the builder's first free day (months ahead on a busy bench);
      // on the whole bench it is the same for every build, so it is worked out once per snapshot.
      const key = exceptBookingId ? null : `${b.id} ${from}`;
      let startsOn = key ? bench.firstFreeDays.get(key) : undefined;
      if (startsOn === undefined) {
        startsOn = firstFreeDay({ from, calendar, taken });
        if (key) bench.firstFreeDays.set(key, startsOn);
      }
      return earliestStart({ laborHours: toCentihours(laborHours), from, calendar, taken, startsOn });
    });
  }

  /** shipByDate on the held bench, worked out once per bench date and snapshot (builders often share one). */
  private shipByOn(bench: BenchSnapshot, benchDate: string): string {
    let day = bench.shipBy.get(benchDate);
    if (!day) bench.shipBy.set(benchDate, (day = shipByDate(benchDate, bench.shop)));
    return day;
  }

  private planOver(
    rows: ReadonlyArray<{ day: string; from_centihours: number; to_centihours: number }>,
    builder: { id: string; weekly_hours: WeeklyHours },
    laborHours: string,
    shop: Pick<ShopCalendar, 'closures' | 'holidayOn' | 'absences'>,
    at: { from: string } | { benchDate: string },
  ): BuildPlan {
    const byDay = new Map<string, HourSlice[]>();
    for (const r of rows) {
      const list = byDay.get(r.day) ?? [];
      list.push({ from: r.from_centihours, to: r.to_centihours });
      byDay.set(r.day, list);
    }
    const calendar = this.calendarOf(builder, shop);
    const input = { laborHours: toCentihours(laborHours), calendar, taken: (d: string) => byDay.get(d) ?? [] };
    return 'from' in at ? earliestStart({ ...input, from: at.from }) : planBuild({ ...input, benchDate: at.benchDate });
  }

  /** Writes a plan as bench slices; overlapping or over-capacity slices are refused by the database. */
  async allocate(
    trx: Executor,
    bookingId: string,
    builder: { id: string; weekly_hours: WeeklyHours },
    shop: Pick<ShopCalendar, 'closures' | 'holidayOn' | 'absences'>,
    plan: Extract<BuildPlan, { ok: true }>,
  ) {
    const calendar = this.calendarOf(builder, shop);
    const rows = plan.days.flatMap((d) => {
      const capacity = dayCapacity(d.day, calendar).capacity;
      return d.slices.map((s) => ({
        bookingId,
        builderId: builder.id,
        day: d.day,
        from: new Decimal(s.from).div(100).toFixed(2),
        to: new Decimal(s.to).div(100).toFixed(2),
        dayCapacity: new Decimal(capacity).div(100).toFixed(2),
      }));
    });
    await this.bench.insertAllocations(trx, rows);
  }

  /** Frees a build's bench time after `day`; returns the hours freed. */
  async releaseAfter(trx: Executor, bookingId: string, day: string): Promise<number> {
    const freed = await this.bench.deleteAllocationsAfter(trx, bookingId, day);
    return toHours(freed.reduce((sum, f) => sum + toCentihours(f.length), 0));
  }

  /** The hours a build holds on the bench now. */
  async hoursHeld(trx: Executor, bookingId: string): Promise<number> {
    const rows = await this.bench.allocationsOf(trx, bookingId);
    return toHours(rows.reduce((sum, r) => sum + toCentihours(r.length), 0));
  }

  releaseAllocations(trx: Executor, bookingId: string) {
    return this.bench.deleteAllocationsOf(trx, bookingId);
  }

  lockBuilder(trx: Executor, builderId: string) {
    return this.bench.lockBuilder(trx, builderId);
  }

  async planningFacts(trx: Executor, bookingId: string): Promise<PlanningFacts> {
    const booking = await this.bench.findBookingForPlanning(trx, bookingId);
    if (!booking) throw new NotFoundException('There is no booking with that id.');
    const quote = await this.bench.latestEstimateQuote(trx, bookingId);
    if (!quote) throw new ConflictException(`Booking ${booking.reference} has no estimate yet, so its bench hours are unknown.`);
    const estimate = quote.estimate;
    const materialsTotal =
      estimate?.materialsTotal ??
      (estimate?.lines ?? [])
        .filter((l) => l.kind === 'materials')
        .reduce((sum, l) => sum.plus(l.amount), new Decimal(0))
        .toFixed(2);
    const minimumLevel: BuilderLevel = estimate?.minimumLevel ?? 'apprentice';
    const picked: BuilderLevel = estimate?.level ?? booking.configuration?.level ?? minimumLevel;
    return {
      bookingId: booking.id,
      reference: booking.reference,
      state: booking.state,
      customerId: booking.customer_id,
      customerName: booking.customer_name,
      customerEmail: booking.customer_email,
      laborHours: quote.labor_hours,
      minimumLevel,
      chosenLevel: levelRank(picked) >= levelRank(minimumLevel) ? picked : minimumLevel,
      quotedHigh: quote.total_high,
      benchDate: booking.bench_date,
      builderId: booking.builder_id,
      materialsTotal,
      deposit: quote.deposit,
      currency: quote.currency.trim(),
      estimateQuote: quote,
      configuration: booking.configuration,
    };
  }

  private orderMeFirst(rows: BuilderRow[], user: AuthUser): BuilderRow[] {
    return [...rows].sort((a, b) => Number(b.user_id === user.id) - Number(a.user_id === user.id));
  }

  private toRef(b: Pick<BuilderRow, 'id' | 'user_id' | 'name' | 'level'>) {
    return { id: b.id, userId: b.user_id, name: b.name, level: b.level };
  }

  private toBenchBuilder(
    b: Pick<BuilderRow, 'id' | 'user_id' | 'name' | 'level' | 'hourly_rate' | 'weekly_hours' | 'active'>,
    user: AuthUser,
  ): BenchBuilder {
    return {
      ...this.toRef(b),
      // Only the owner sees every rate; a builder sees their own (see DEVELOPERS.md, who may see what).
      hourlyRate: user.role === 'owner' || b.user_id === user.id ? b.hourly_rate : null,
      weeklyHours: b.weekly_hours,
      active: b.active,
      isMe: b.user_id === user.id,
    };
  }
}

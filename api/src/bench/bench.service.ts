import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import {
  levelRank,
  type AuthUser,
  type BenchBuilder,
  type BenchDay,
  type BenchLeadTime,
  type BenchSuggestResponse,
  type BenchSuggestion,
  type BenchView,
  type BuilderLevel,
  type WeeklyHours,
} from '@loomwright/shared';
import { Database, type Executor } from '../database/database';
import { firmQuoteFigures } from '../builds/firm-quote';
import { BenchRepository } from './bench.repository';
import { addDays, daysBetween, eachDay, todayIn } from './calendar-days';
import { publicHolidaysBetween } from './public-holidays';
import {
  dayCapacity,
  earliestBenchDateFor,
  earliestStart,
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

type BuilderRow = Awaited<ReturnType<BenchRepository['listBuilders']>>[number];

/** What the firm quote and the planner need to know about a booking's estimate. */
export interface PlanningFacts {
  bookingId: string;
  reference: string;
  state: string;
  customerId: string;
  customerName: string;
  customerEmail: string;
  laborHours: string;
  minimumLevel: BuilderLevel;
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

  async shopCalendar(trx: Executor = this.db): Promise<{ closures: Closure[]; holidayOn: (d: string) => string | null; today: string; currency: string }> {
    const [settings, closures] = await Promise.all([this.bench.shopSettings(trx), this.bench.closures(trx)]);
    const country = settings?.country_code.trim() ?? 'US';
    return {
      closures: closures.map((c) => ({ startsOn: c.starts_on, endsOn: c.ends_on, reason: c.reason })),
      holidayOn: this.holidayOn(country),
      today: todayIn(settings?.timezone ?? 'UTC'),
      currency: settings?.currency.trim() ?? 'USD',
    };
  }

  async view(user: AuthUser, query: { from?: string; to?: string; builderId?: string }): Promise<BenchView> {
    const shop = await this.shopCalendar();
    const from = query.from ?? shop.today;
    const to = query.to ?? addDays(from, 13);
    const span = daysBetween(from, to);
    if (span < 0) throw new BadRequestException('to must be on or after from.');
    if (span >= MAX_BENCH_VIEW_DAYS) throw new BadRequestException(`Ask for at most ${MAX_BENCH_VIEW_DAYS} days of bench at a time (from and to).`);
    const builders = this.orderMeFirst(await this.bench.listBuilders(this.db, { builderId: query.builderId }), user);
    if (query.builderId && builders.length === 0) throw new NotFoundException('There is no builder with that builderId.');
    const slices = await this.bench.allocationsBetween(this.db, builders.map((b) => b.id), from, to);
    const days = eachDay(from, to);
    return {
      from,
      to,
      builders: builders.map((b) => {
        const calendar: BenchCalendar = { weeklyHours: b.weekly_hours, closures: shop.closures, holidayOn: shop.holidayOn };
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
              };
              entry.hours = toHours(toCentihours(entry.hours) + length);
              byBooking.set(s.booking_id, entry);
            }
            return {
              date: day,
              capacityHours: toHours(capacity),
              bookedHours: toHours(booked),
              freeHours: toHours(Math.max(0, capacity - booked)),
              off,
              builds: [...byBooking.values()],
            };
          }),
        };
      }),
    };
  }

  async suggest(user: AuthUser, bookingId: string, builderId?: string): Promise<BenchSuggestResponse> {
    const facts = await this.planningFacts(this.db, bookingId);
    if (!['requested', 'deposit_paid'].includes(facts.state)) {
      throw new ConflictException(`Booking ${facts.reference} is ${facts.state.replace('_', ' ')}; only a request waiting for a bench date gets a suggestion.`);
    }
    const shop = await this.shopCalendar();
    const builders = this.orderMeFirst(await this.bench.listBuilders(this.db, { builderId, activeOnly: !builderId }), user);
    if (builderId && builders.length === 0) throw new NotFoundException('There is no builder with that builderId.');
    const from = earliestBenchDateFor(shop.today, shop);
    const suggestions: BenchSuggestion[] = [];
    const ineligible: BenchSuggestResponse['ineligible'] = [];
    for (const b of builders) {
      const meets = levelRank(b.level) >= levelRank(facts.minimumLevel);
      if (!builderId && !meets) {
        ineligible.push({ builder: this.toRef(b), reason: `This rig needs at least a ${facts.minimumLevel} builder; ${b.name} is ${b.level}.` });
        continue;
      }
      const plan = await this.planFor(this.db, b.weekly_hours, b.id, facts.laborHours, shop, { from });
      if (!plan.ok) {
        ineligible.push({ builder: this.toRef(b), reason: plan.message });
        continue;
      }
      const figures = firmQuoteFigures({ hourlyRate: b.hourly_rate, laborHours: facts.laborHours, materialsTotal: facts.materialsTotal, deposit: facts.deposit });
      suggestions.push({
        builder: this.toBenchBuilder(b, user),
        benchDate: plan.benchDate,
        expectedCompletion: plan.expectedCompletion,
        shipBy: shipByDate(plan.benchDate, shop),
        plan: plan.days.map((d) => ({ date: d.day, hours: toHours(d.hours) })),
        laborTotal: figures.laborTotal,
        firmTotal: figures.total,
        meetsMinimumLevel: meets,
      });
    }
    // Earliest start first; the signed-in builder wins a tie (the list is already "me first").
    suggestions.sort((a, b) => a.benchDate.localeCompare(b.benchDate));
    return {
      bookingId: facts.bookingId,
      reference: facts.reference,
      laborHours: Number(facts.laborHours),
      minimumLevel: facts.minimumLevel,
      currency: facts.currency,
      materialsTotal: facts.materialsTotal,
      deposit: facts.deposit,
      suggestions,
      ineligible,
    };
  }

  /**
   * The earliest start any active builder of at least `level` could give a build of `laborHours`,
   * by the same search a builder's acceptance makes, so the date a player sees is one the shop can
   * hold (it is not reserved until a builder accepts the paid request, which is then offered this
   * date or an earlier one).
   */
  async leadTime(laborHours: string, level: BuilderLevel): Promise<BenchLeadTime> {
    const shop = await this.shopCalendar();
    // The player has yet to pay and a builder to accept, so the ship-by day is counted from a
    // couple of days ahead, never from today.
    const from = earliestBenchDateFor(addDays(shop.today, ACCEPTANCE_ALLOWANCE_DAYS), shop);
    const builders = (await this.bench.listBuilders(this.db, { activeOnly: true })).filter((b) => levelRank(b.level) >= levelRank(level));
    let best: { benchDate: string; expectedCompletion: string } | null = null;
    for (const b of builders) {
      const plan = await this.planFor(this.db, b.weekly_hours, b.id, laborHours, shop, { from });
      if (!plan.ok) continue;
      const earlier = !best || plan.benchDate < best.benchDate || (plan.benchDate === best.benchDate && plan.expectedCompletion < best.expectedCompletion);
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
    return { laborHours, level, earliestBenchDate: best.benchDate, expectedCompletion: best.expectedCompletion, shipBy: shipByDate(best.benchDate, shop) };
  }

  /**
   * Plans a build for one builder against the bench as this executor sees it. Inside an accept
   * transaction that holds the builder's lock, that view is current.
   */
  async planFor(
    trx: Executor,
    weeklyHours: WeeklyHours,
    builderId: string,
    laborHours: string,
    shop: { closures: Closure[]; holidayOn: (d: string) => string | null },
    at: { from: string } | { benchDate: string },
  ): Promise<BuildPlan & { capacities?: Map<string, number> }> {
    const start = 'from' in at ? at.from : at.benchDate;
    const rows = await this.bench.allocationsFrom(trx, builderId, start);
    const byDay = new Map<string, HourSlice[]>();
    for (const r of rows) {
      const list = byDay.get(r.day) ?? [];
      list.push({ from: toCentihours(r.lower), to: toCentihours(r.upper) });
      byDay.set(r.day, list);
    }
    const calendar: BenchCalendar = { weeklyHours, closures: shop.closures, holidayOn: shop.holidayOn };
    const input = { laborHours: toCentihours(laborHours), calendar, taken: (d: string) => byDay.get(d) ?? [] };
    return 'from' in at ? earliestStart({ ...input, from: at.from }) : planBuild({ ...input, benchDate: at.benchDate });
  }

  /** Writes a plan as bench slices; overlapping or over-capacity slices are refused by the database. */
  async allocate(trx: Executor, bookingId: string, builderId: string, weeklyHours: WeeklyHours, shop: { closures: Closure[]; holidayOn: (d: string) => string | null }, plan: Extract<BuildPlan, { ok: true }>) {
    const calendar: BenchCalendar = { weeklyHours, closures: shop.closures, holidayOn: shop.holidayOn };
    const rows = plan.days.flatMap((d) => {
      const capacity = dayCapacity(d.day, calendar).capacity;
      return d.slices.map((s) => ({
        bookingId,
        builderId,
        day: d.day,
        from: new Decimal(s.from).div(100).toFixed(2),
        to: new Decimal(s.to).div(100).toFixed(2),
        dayCapacity: new Decimal(capacity).div(100).toFixed(2),
      }));
    });
    await this.bench.insertAllocations(trx, rows);
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
      (estimate?.lines ?? []).filter((l) => l.kind === 'materials').reduce((sum, l) => sum.plus(l.amount), new Decimal(0)).toFixed(2);
    return {
      bookingId: booking.id,
      reference: booking.reference,
      state: booking.state,
      customerId: booking.customer_id,
      customerName: booking.customer_name,
      customerEmail: booking.customer_email,
      laborHours: quote.labor_hours,
      minimumLevel: estimate?.minimumLevel ?? 'apprentice',
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

  private toRef(b: BuilderRow) {
    return { id: b.id, userId: b.user_id, name: b.name, level: b.level };
  }

  private toBenchBuilder(b: BuilderRow, user: AuthUser): BenchBuilder {
    return {
      ...this.toRef(b),
      hourlyRate: b.hourly_rate,
      weeklyHours: b.weekly_hours,
      active: b.active,
      isMe: b.user_id === user.id,
    };
  }
}

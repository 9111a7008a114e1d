import { BadRequestException, Injectable } from '@nestjs/common';
import Decimal from 'decimal.js';
import {
  MAX_UTILISATION_DAYS,
  type DateRangeQuery,
  type HoursBuilderRow,
  type HoursReport,
  type OutstandingItem,
  type OutstandingReport,
  type RevenueMonth,
  type RevenueReport,
  type UtilisationReport,
} from '@loomwright/shared';
import { addDays, daysBetween, eachDay, todayIn } from '../bench/calendar-days';
import { BenchService } from '../bench/bench.service';
import { dayCapacity, toHours } from '../bench/scheduling';
import { bookingMoney } from '../exports/booking-money';
import { dayInTimeZone } from '../exports/csv-cells';
import { OfficeRepository } from '../exports/office.repository';
import { isoWeekLabel, mondayOf } from './iso-week';

const sum = (values: Decimal.Value[]) => values.reduce<Decimal>((s, v) => s.plus(v), new Decimal(0));
const hours = (d: Decimal.Value) => new Decimal(d).toFixed(2);
const percent = (part: Decimal.Value, whole: Decimal.Value) =>
  new Decimal(whole).isZero() ? null : new Decimal(part).div(whole).times(100).toFixed(1);

/** A request waiting for its deposit; a build whose balance is owed (the pedals may still be on their way). */
const DEPOSIT_STATES = ['requested'];
const BALANCE_STATES = ['scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered'];

/**
 * The owner's reports. Each reads the same rows as a CSV export (OfficeRepository), so every figure
 * can be checked by summing the file: revenue = payments.csv by month; hours = hours.csv; money
 * outstanding = the balance_due and deposit columns of bookings.csv.
 */
@Injectable()
export class ReportsService {
  constructor(
    private readonly office: OfficeRepository,
    private readonly bench: BenchService,
  ) {}

  async revenue(query: DateRangeQuery): Promise<RevenueReport> {
    const shop = await this.office.shop();
    const rows = await this.office.moneyByMonth({ ...query, timeZone: shop.timezone });
    const months = new Map<string, RevenueMonth>();
    for (const r of rows) {
      const key = `${r.month} ${r.currency}`;
      const m = months.get(key) ?? {
        month: r.month,
        currency: r.currency,
        deposits: '0.00',
        balances: '0.00',
        refunds: '0.00',
        net: '0.00',
      };
      if (r.entry === 'refund') m.refunds = new Decimal(m.refunds).minus(r.amount).toFixed(2);
      else if (r.payment_kind === 'deposit') m.deposits = new Decimal(m.deposits).plus(r.amount).toFixed(2);
      else m.balances = new Decimal(m.balances).plus(r.amount).toFixed(2);
      m.net = new Decimal(m.deposits).plus(m.balances).minus(m.refunds).toFixed(2);
      months.set(key, m);
    }
    // Every month of the range appears, an empty one with zeros, so a chart's gaps are real months.
    const currencies = new Set([shop.currency.trim(), ...rows.map((r) => r.currency)]);
    for (const month of monthsBetween(query.from, query.to)) {
      for (const currency of currencies) {
        const key = `${month} ${currency}`;
        if (!months.has(key) && (currency === shop.currency.trim() || rows.some((r) => r.currency === currency))) {
          months.set(key, { month, currency, deposits: '0.00', balances: '0.00', refunds: '0.00', net: '0.00' });
        }
      }
    }
    const list = [...months.values()].sort((a, b) => a.month.localeCompare(b.month) || a.currency.localeCompare(b.currency));
    const totals = [...currencies].map((currency) => {
      const mine = list.filter((m) => m.currency === currency);
      return {
        currency,
        deposits: sum(mine.map((m) => m.deposits)).toFixed(2),
        balances: sum(mine.map((m) => m.balances)).toFixed(2),
        refunds: sum(mine.map((m) => m.refunds)).toFixed(2),
        net: sum(mine.map((m) => m.net)).toFixed(2),
      };
    });
    return { from: query.from, to: query.to, timeZone: shop.timezone, months: list, totals };
  }

  /** Money owed to the shop now (deposits of open requests, balances of builds) and money it holds beyond what is owed. */
  async outstanding(): Promise<OutstandingReport> {
    const shop = await this.office.shop();
    const rows = await this.office.bookingsInStates([...DEPOSIT_STATES, ...BALANCE_STATES]).execute();
    const items: OutstandingItem[] = [];
    for (const b of rows) {
      const { currency, money } = bookingMoney(b, shop.currency.trim());
      const base = {
        bookingId: b.id,
        reference: b.reference,
        state: b.state,
        customerName: b.customer_name,
        builderName: b.builder_name,
        currency,
      };
      if (DEPOSIT_STATES.includes(b.state) && new Decimal(money.paid).isZero() && b.estimate) {
        items.push({ ...base, kind: 'deposit', amount: b.estimate.deposit, since: dayInTimeZone(b.created_at, shop.timezone) });
      }
      if (BALANCE_STATES.includes(b.state) && money.balanceDue !== null && new Decimal(money.balanceDue).gt(0) && !money.balanceWaived) {
        items.push({ ...base, kind: 'balance', amount: money.balanceDue, since: b.bench_date });
      }
      if (new Decimal(money.credit).gt(0)) items.push({ ...base, kind: 'credit', amount: money.credit, since: null });
    }
    const totals = new Map<string, OutstandingReport['totals'][number]>();
    for (const i of items) {
      const key = `${i.kind} ${i.currency}`;
      const t = totals.get(key) ?? { kind: i.kind, currency: i.currency, amount: '0.00', count: 0 };
      t.amount = new Decimal(t.amount).plus(i.amount).toFixed(2);
      t.count += 1;
      totals.set(key, t);
    }
    return { asOf: todayIn(shop.timezone), items, totals: [...totals.values()] };
  }

  async hours(query: DateRangeQuery): Promise<HoursReport> {
    const shop = await this.office.shop();
    const range = { ...query, timeZone: shop.timezone };
    const [builds, own, builders] = await Promise.all([
      this.office.hoursPerBuild(range),
      this.office.hoursPerBuilder(range),
      this.office.builders(),
    ]);
    const buildRows = builds.map((b) => ({
      bookingId: b.id,
      reference: b.reference,
      state: b.state,
      builderId: b.builder_id,
      builderName: b.builder_name,
      quotedHours: hours(b.quoted_hours),
      hoursInRange: hours(b.hours_in_range),
      hoursToDate: hours(b.hours_to_date),
      overQuote: hours(new Decimal(b.hours_to_date).minus(b.quoted_hours)),
    }));
    const builderRows: HoursBuilderRow[] = builders
      .map((bl) => {
        const assigned = buildRows.filter((b) => b.builderId === bl.id);
        const quoted = sum(assigned.map((b) => b.quotedHours));
        const toDate = sum(assigned.map((b) => b.hoursToDate));
        return {
          builderId: bl.id,
          builderName: bl.name,
          level: bl.level,
          hoursInRange: hours(own.find((o) => o.builder_id === bl.id)?.hours ?? 0),
          builds: assigned.length,
          quotedHours: hours(quoted),
          hoursToDate: hours(toDate),
          overQuote: hours(toDate.minus(quoted)),
        };
      })
      .filter((r) => r.builds > 0 || new Decimal(r.hoursInRange).gt(0));
    return { from: query.from, to: query.to, builds: buildRows, builders: builderRows };
  }

  /** Capacity, booked and recorded hours per builder per ISO week, the weeks that touch the range. */
  async utilisation(query: DateRangeQuery): Promise<UtilisationReport> {
    const from = mondayOf(query.from);
    const to = addDays(mondayOf(query.to), 6);
    if (daysBetween(from, to) >= MAX_UTILISATION_DAYS) {
      throw new BadRequestException(
        `Bench utilisation covers at most ${MAX_UTILISATION_DAYS} days at a time; choose a shorter range from … to.`,
      );
    }
    const [builders, calendar, booked, recorded] = await Promise.all([
      this.office.builders(),
      this.bench.shopCalendar(),
      this.office.bookedPerDay(from, to),
      this.office.recordedPerDay(from, to),
    ]);
    const days = eachDay(from, to);
    return {
      from,
      to,
      builders: builders.map((bl) => {
        const cal = this.bench.calendarOf(bl, calendar);
        const weeks = new Map<string, { capacity: Decimal; booked: Decimal; recorded: Decimal }>();
        for (const day of days) {
          const monday = mondayOf(day);
          const w = weeks.get(monday) ?? { capacity: new Decimal(0), booked: new Decimal(0), recorded: new Decimal(0) };
          // An inactive builder has no capacity, but hours they were booked or worked still show.
          if (bl.active) w.capacity = w.capacity.plus(toHours(dayCapacity(day, cal).capacity));
          w.booked = w.booked.plus(booked.find((b) => b.builder_id === bl.id && b.day === day)?.hours ?? 0);
          w.recorded = w.recorded.plus(recorded.find((r) => r.builder_id === bl.id && r.day === day)?.hours ?? 0);
          weeks.set(monday, w);
        }
        return {
          builderId: bl.id,
          builderName: bl.name,
          level: bl.level,
          weeks: [...weeks.entries()].map(([weekStart, w]) => ({
            weekStart,
            isoWeek: isoWeekLabel(weekStart),
            capacityHours: hours(w.capacity),
            bookedHours: hours(w.booked),
            recordedHours: hours(w.recorded),
            bookedPercent: percent(w.booked, w.capacity),
            recordedPercent: percent(w.recorded, w.capacity),
          })),
        };
      }),
    };
  }
}

/** 'YYYY-MM' of every month the range touches. */
function monthsBetween(from: string, to: string): string[] {
  const out: string[] = [];
  let [y, m] = from.split('-').map(Number);
  const [ty, tm] = to.split('-').map(Number);
  while (y < ty || (y === ty && m <= tm)) {
    out.push(`${y}-${String(m).padStart(2, '0')}`);
    m += 1;
    if (m > 12) {
      m = 1;
      y += 1;
    }
  }
  return out;
}

import { Injectable } from '@nestjs/common';
import { sql, type RawBuilder } from 'kysely';
import { BookingsRepository, quotedHoursOf } from '../bookings/bookings.repository';
import { BuildsRepository } from '../builds/builds.repository';
import { Database, type Executor } from '../database/database';

/** A range of the shop's calendar days, both ends included, read on the shop's wall clock. */
export interface ShopRange {
  from: string;
  to: string;
  timeZone: string;
}

/** The first instant of `from` and the first instant after `to`, on the shop's wall clock. */
export const rangeStart = (r: ShopRange): RawBuilder<Date> => sql<Date>`(${r.from}::date)::timestamp at time zone ${r.timeZone}`;
export const rangeEnd = (r: ShopRange): RawBuilder<Date> => sql<Date>`(${r.to}::date + 1)::timestamp at time zone ${r.timeZone}`;

/** Rows are read this many at a time from a server-side cursor. */
export const STREAM_CHUNK = 1000;

/** One money movement: a payment that arrived, or a refund of one (the whole payment goes back). */
export interface MoneyMovementRow {
  at: Date;
  entry: 'payment' | 'refund';
  payment_kind: 'deposit' | 'balance';
  amount: string;
  currency: string;
  method: string;
  reference: string;
  customer_name: string;
  customer_email: string;
  payment_id: string;
  provider_payment: string | null;
  provider_refund: string | null;
}

/**
 * Every query of the shop's office (exports and reports). The export queries stream through a
 * cursor; the same filters feed the reports, so a report's figure and the CSV's sum are the same rows.
 */
@Injectable()
export class OfficeRepository {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsRepository,
    private readonly builds: BuildsRepository,
  ) {}

  shop(trx: Executor = this.db) {
    return trx
      .selectFrom('shop_settings')
      .select(['timezone', 'currency', 'country_code', 'name'])
      .where('id', '=', 1)
      .executeTakeFirstOrThrow();
  }

  /** Bookings requested in the range, with what the money facts and the hours need. */
  bookingsQuery(r: ShopRange, trx: Executor = this.db) {
    return this.bookingsWithMoney(trx)
      .where('b.created_at', '>=', rangeStart(r))
      .where('b.created_at', '<', rangeEnd(r))
      .orderBy('b.created_at')
      .orderBy('b.id');
  }

  /** Bookings in the given states (whenever requested), with the same columns as the export. */
  bookingsInStates(states: string[], trx: Executor = this.db) {
    return this.bookingsWithMoney(trx)
      .where(sql<boolean>`b.state::text in (${sql.join(states)})`)
      .orderBy('b.created_at')
      .orderBy('b.id');
  }

  private bookingsWithMoney(trx: Executor) {
    return this.bookings.withPeople(trx).select([
      'b.id',
      'b.reference',
      'b.created_at',
      'b.state',
      'b.bench_date',
      'b.expected_completion',
      'b.balance_waived_reason',
      'c.name as customer_name',
      sql<string>`c.email::text`.as('customer_email'),
      'bu.name as builder_name',
      'bl.level as builder_level',
      sql<{ currency: string; total_low: string; total_high: string; deposit: string; labor_hours: string } | null>`(
          select json_build_object('currency', trim(q.currency), 'total_low', q.total_low::text, 'total_high', q.total_high::text,
                                   'deposit', q.deposit::text, 'labor_hours', q.labor_hours::text)
          from quotes q where q.booking_id = b.id and q.kind = 'estimate' order by q.created_at, q.id limit 1)`.as('estimate'),
      sql<{ currency: string; total: string; labor_hours: string } | null>`(
          select json_build_object('currency', trim(q.currency), 'total', q.total::text, 'labor_hours', q.labor_hours::text)
          from quotes q where q.booking_id = b.id and q.kind = 'firm' order by q.created_at desc, q.id desc limit 1)`.as('firm'),
      sql<Array<{ amount: string; status: 'proposed' | 'approved' | 'declined' }>>`coalesce((
          select json_agg(json_build_object('amount', e.amount::text, 'status', e.status))
          from booking_extras e where e.booking_id = b.id), '[]'::json)`.as('extras'),
      sql<
        Array<{
          kind: 'deposit' | 'balance';
          amount: string;
          status: string;
          currency: string;
          paid_at: string | null;
          refunded_at: string | null;
        }>
      >`coalesce((
          select json_agg(json_build_object('kind', p.kind, 'amount', p.amount::text, 'status', p.status, 'currency', trim(p.currency),
                                            'paid_at', p.paid_at, 'refunded_at', p.refunded_at) order by p.created_at)
          from payments p where p.booking_id = b.id), '[]'::json)`.as('payments'),
      sql<string>`coalesce((select sum(t.hours) from time_entries t where t.booking_id = b.id), 0)::text`.as('recorded_hours'),
    ]);
  }

  /**
   * Money movements in the range: each payment on the day it arrived, each refund on the day the
   * money went back (a refunded payment shows twice: in, then out). Only money that arrived counts,
   * as in the booking's money facts (status paid, or refunded after being paid).
   */
  moneyMovementsQuery(r: ShopRange, trx: Executor = this.db) {
    return (
      trx
        .selectFrom(this.moneyMovements(r, trx).as('m'))
        .selectAll()
        .orderBy('m.at')
        .orderBy('m.payment_id')
        .orderBy('m.entry')
        // paid_at and refunded_at are nullable columns, but the filters keep only rows that have them.
        .$castTo<MoneyMovementRow>()
    );
  }

  /** The movements' money summed per calendar month of the shop, currency, entry and kind: the revenue report. */
  moneyByMonth(r: ShopRange, trx: Executor = this.db) {
    return trx
      .selectFrom(this.moneyMovements(r, trx).as('m'))
      .select([
        sql<string>`to_char(m.at at time zone ${r.timeZone}, 'YYYY-MM')`.as('month'),
        'm.currency',
        'm.entry',
        'm.payment_kind',
        sql<string>`sum(m.amount::numeric)::text`.as('amount'),
      ])
      .groupBy([sql`1`, 'm.currency', 'm.entry', 'm.payment_kind'])
      .orderBy(sql`1`)
      .execute();
  }

  private moneyMovements(r: ShopRange, trx: Executor) {
    const common = (entry: 'payment' | 'refund') =>
      trx
        .selectFrom('payments as p')
        .innerJoin('bookings as b', 'b.id', 'p.booking_id')
        .innerJoin('users as c', 'c.id', 'b.customer_id')
        .select([
          sql<string>`${entry}`.as('entry'),
          'p.kind as payment_kind',
          sql<string>`trim(p.currency)`.as('currency'),
          sql<string>`p.method`.as('method'),
          'b.reference',
          'c.name as customer_name',
          sql<string>`c.email::text`.as('customer_email'),
          'p.id as payment_id',
          'p.payment_intent_id as provider_payment',
        ]);
    const payments = common('payment')
      .select(['p.paid_at as at', sql<string>`p.amount::text`.as('amount'), sql<string | null>`null::text`.as('provider_refund')])
      .where('p.status', 'in', ['paid', 'refunded'])
      .where('p.paid_at', '>=', rangeStart(r))
      .where('p.paid_at', '<', rangeEnd(r));
    const refunds = common('refund')
      .select(['p.refunded_at as at', sql<string>`(-p.amount)::text`.as('amount'), 'p.refund_id as provider_refund'])
      .where('p.status', '=', 'refunded')
      .where('p.refunded_at', '>=', rangeStart(r))
      .where('p.refunded_at', '<', rangeEnd(r));
    return payments.unionAll(refunds);
  }

  /** Hour entries worked on a day in the range. */
  hoursQuery(r: ShopRange, trx: Executor = this.db) {
    return this.builds
      .timeEntriesWithPeople(trx)
      .innerJoin('bookings as b', 'b.id', 't.booking_id')
      .select([
        't.id',
        't.worked_on',
        'b.id as booking_id',
        'b.reference',
        'tb.id as builder_id',
        'tu.name as builder_name',
        'tb.level as builder_level',
        sql<string>`t.hours::text`.as('hours'),
        't.note',
        'w.name as recorded_by',
        't.created_at',
      ])
      .where('t.worked_on', '>=', r.from)
      .where('t.worked_on', '<=', r.to)
      .orderBy('t.worked_on')
      .orderBy('b.reference')
      .orderBy('t.created_at')
      .orderBy('t.id');
  }

  /** Builds with hour entries worked in the range: quoted hours against the hours in the range and to date. */
  hoursPerBuild(r: ShopRange, trx: Executor = this.db) {
    return this.bookings
      .withPeople(trx)
      .innerJoin('time_entries as t', 't.booking_id', 'b.id')
      .select([
        'b.id',
        'b.reference',
        'b.state',
        'bl.id as builder_id',
        'bu.name as builder_name',
        sql<string>`coalesce(${quotedHoursOf('b.id')}, '0')`.as('quoted_hours'),
        sql<string>`coalesce(sum(t.hours) filter (where t.worked_on between ${r.from} and ${r.to}), 0)::text`.as('hours_in_range'),
        sql<string>`sum(t.hours)::text`.as('hours_to_date'),
      ])
      .groupBy(['b.id', 'bl.id', 'bu.name'])
      .having(sql<boolean>`bool_or(t.worked_on between ${r.from} and ${r.to})`)
      .orderBy('b.reference')
      .execute();
  }

  /** Each builder's own hour entries in the range. */
  hoursPerBuilder(r: ShopRange, trx: Executor = this.db) {
    return trx
      .selectFrom('time_entries as t')
      .select(['t.builder_id', sql<string>`sum(t.hours)::text`.as('hours')])
      .where('t.worked_on', '>=', r.from)
      .where('t.worked_on', '<=', r.to)
      .groupBy('t.builder_id')
      .execute();
  }

  /** Every builder who has joined (a pending invitation has no bench), with their week. */
  builders(trx: Executor = this.db) {
    return trx
      .selectFrom('builders as bl')
      .innerJoin('users as u', 'u.id', 'bl.user_id')
      .select(['bl.id', 'u.name', 'bl.level', 'bl.weekly_hours', 'bl.active'])
      .where('u.password_hash', 'is not', null)
      .orderBy('u.name')
      .execute();
  }

  /** Booked bench hours per builder and day. */
  bookedPerDay(from: string, to: string, trx: Executor = this.db) {
    return trx
      .selectFrom('bench_allocations as a')
      .select(['a.builder_id', 'a.day', sql<string>`sum(upper(a.hours) - lower(a.hours))::text`.as('hours')])
      .where('a.day', '>=', from)
      .where('a.day', '<=', to)
      .groupBy(['a.builder_id', 'a.day'])
      .execute();
  }

  /** Recorded hours per builder and day. */
  recordedPerDay(from: string, to: string, trx: Executor = this.db) {
    return trx
      .selectFrom('time_entries as t')
      .select(['t.builder_id', 't.worked_on as day', sql<string>`sum(t.hours)::text`.as('hours')])
      .where('t.worked_on', '>=', from)
      .where('t.worked_on', '<=', to)
      .groupBy(['t.builder_id', 't.worked_on'])
      .execute();
  }
}

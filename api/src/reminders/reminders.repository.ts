import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import type { ReminderKind } from '@loomwright/shared';
import { BookingsRepository } from '../bookings/bookings.repository';
import { Database, type Executor } from '../database/database';

/**
 * Every query of the reminder jobs. Each "due" query takes an optional booking id: the sweep asks
 * for every candidate, then asks again for one booking inside the transaction that holds its lock,
 * so a payment or a tracking number that arrived in between is seen before anything is sent.
 */
@Injectable()
export class RemindersRepository {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsRepository,
  ) {}

  settings(trx: Executor = this.db) {
    return trx.selectFrom('reminder_settings').select(['kind', 'enabled', 'amount']).execute();
  }

  updateSetting(trx: Executor, kind: ReminderKind, values: { enabled?: boolean; amount?: number }, by: string) {
    return trx
      .updateTable('reminder_settings')
      .set({ ...values, updated_at: sql`now()`, updated_by: by } as never)
      .where('kind', '=', kind)
      .execute();
  }

  shop(trx: Executor = this.db) {
    return trx
      .selectFrom('shop_settings')
      .select(['name', 'timezone', 'locale', 'currency', 'contact_email'])
      .where('id', '=', 1)
      .executeTakeFirst();
  }

  /**
   * The one insert that decides whether a reminder goes out: the unique key (kind, booking, event)
   * lets exactly one transaction write it; any other finds it taken (after waiting for the first to
   * commit) and gets nothing back.
   */
  async claim(trx: Executor, reminder: { kind: ReminderKind; bookingId: string; eventKey: string; dueAt: Date }): Promise<boolean> {
    const row = await trx
      .insertInto('reminders')
      .values({ kind: reminder.kind, booking_id: reminder.bookingId, event_key: reminder.eventKey, due_at: reminder.dueAt })
      .onConflict((oc) => oc.columns(['kind', 'booking_id', 'event_key']).doNothing())
      .returning('id')
      .executeTakeFirst();
    return row !== undefined;
  }

  private bookingsWithPeople(trx: Executor) {
    return this.bookings.withPeopleNamed(trx).select(['b.bench_date', 'b.created_at', 'b.customer_id', 'c.email as customer_email']);
  }

  /** Scheduled builds, pedals still to come, bench date from `from` to `to`, no tracking number. */
  shipByDue(range: { from: string; to: string }, bookingId?: string, trx: Executor = this.db) {
    let query = this.bookingsWithPeople(trx)
      .select(['bu.id as builder_user_id', 'bu.name as builder_name', 'bu.email as builder_email'])
      .where('b.state', '=', 'scheduled')
      .where('b.bench_date', '>=', range.from)
      .where('b.bench_date', '<=', range.to)
      .where((eb) => eb.or([eb('b.inbound_tracking', 'is', null), eb(sql`trim(b.inbound_tracking)`, '=', '')]));
    if (bookingId) query = query.where('b.id', '=', bookingId);
    return query.orderBy('b.bench_date').execute();
  }

  /** Ready builds whose move to ready is at least `readyBefore` old, with that move's history line. */
  balanceDue(readyBefore: Date, bookingId?: string, trx: Executor = this.db) {
    let query = this.bookingsWithPeople(trx)
      .innerJoinLateral(
        (eb) =>
          eb
            .selectFrom('booking_events as e')
            .select(['e.id as ready_event_id', 'e.created_at as ready_at'])
            .whereRef('e.booking_id', '=', 'b.id')
            .where('e.to_state', '=', 'ready')
            .where(sql<boolean>`e.from_state is distinct from 'ready'`)
            .orderBy('e.created_at', 'desc')
            .limit(1)
            .as('r'),
        (join) => join.onTrue(),
      )
      .select(['r.ready_event_id', 'r.ready_at'])
      .where('b.state', '=', 'ready')
      .where('r.ready_at', '<=', readyBefore);
    if (bookingId) query = query.where('b.id', '=', bookingId);
    return query.execute();
  }

  /** Checkouts still pending since before `openedBefore`, for what the booking owes now. */
  checkoutsUnfinished(openedBefore: Date, bookingId?: string, trx: Executor = this.db) {
    let query = this.bookingsWithPeople(trx)
      .innerJoin('payments as p', 'p.booking_id', 'b.id')
      .select(['p.id as payment_id', 'p.kind', 'p.amount', 'p.currency', 'p.created_at as opened_at'])
      .where('p.status', '=', 'pending')
      .where('p.method', '=', 'checkout')
      .where('p.checkout_session_id', 'is not', null)
      .where('p.created_at', '<=', openedBefore)
      .where((eb) =>
        eb.or([
          eb.and([eb('p.kind', '=', 'deposit'), eb('b.state', '=', 'requested')]),
          eb.and([eb('p.kind', '=', 'balance'), eb('b.state', '=', 'ready')]),
        ]),
      );
    if (bookingId) query = query.where('b.id', '=', bookingId);
    return query.orderBy('p.created_at').execute();
  }

  /** Requests made before `requestedBefore` whose deposit is still unpaid. */
  requestsUnpaid(requestedBefore: Date, bookingId?: string, trx: Executor = this.db) {
    let query = this.bookingsWithPeople(trx).where('b.state', '=', 'requested').where('b.created_at', '<=', requestedBefore);
    if (bookingId) query = query.where('b.id', '=', bookingId);
    return query.orderBy('b.created_at').execute();
  }

  /** Bench hours held by a booking (a request never holds any; expiry checks before closing it). */
  async benchHoursHeld(trx: Executor, bookingId: string): Promise<number> {
    const row = await trx
      .selectFrom('bench_allocations')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('booking_id', '=', bookingId)
      .executeTakeFirst();
    return Number(row?.n ?? 0);
  }

  /** A payment of this kind in one of these states (a bank debit settling, or paid): money on its way. */
  async hasPayment(trx: Executor, bookingId: string, kind: 'deposit' | 'balance', statuses: ('processing' | 'paid')[]): Promise<boolean> {
    const row = await trx
      .selectFrom('payments')
      .select('id')
      .where('booking_id', '=', bookingId)
      .where('kind', '=', kind)
      .where('status', 'in', statuses)
      .executeTakeFirst();
    return row !== undefined;
  }
}

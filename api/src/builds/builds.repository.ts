import { Injectable } from '@nestjs/common';
import { sql, type Insertable, type Updateable } from 'kysely';
import type { BookingState } from '@loomwright/shared';
import { Database, Executor, type BookingsTable, type QuotesTable } from '../database/database';

@Injectable()
export class BuildsRepository {
  constructor(private readonly db: Database) {}

  /** The booking row, locked until the transaction ends: one change to a booking at a time. */
  lockBooking(trx: Executor, id: string) {
    return trx
      .selectFrom('bookings as b')
      .innerJoin('users as c', 'c.id', 'b.customer_id')
      .selectAll('b')
      .select(['c.name as customer_name', 'c.email as customer_email'])
      .where('b.id', '=', id)
      .forUpdate('b')
      .executeTakeFirst();
  }

  findBooking(trx: Executor, id: string) {
    return trx.selectFrom('bookings').selectAll().where('id', '=', id).executeTakeFirst();
  }

  /** Moves the state only if it is still one of `from` (the lock makes this certain; the guard documents it). */
  updateBooking(trx: Executor, id: string, from: BookingState[], values: Updateable<BookingsTable>) {
    return trx
      .updateTable('bookings')
      .set({ ...values, updated_at: sql`now()` })
      .where('id', '=', id)
      .where('state', 'in', from)
      .returningAll()
      .executeTakeFirst();
  }

  insertEvent(
    trx: Executor,
    event: { bookingId: string; from: BookingState | null; to: BookingState; actorId: string | null; actorLabel: string; note: string },
  ) {
    return trx
      .insertInto('booking_events')
      .values({
        booking_id: event.bookingId,
        from_state: event.from,
        to_state: event.to,
        actor_id: event.actorId,
        actor_label: event.actorLabel,
        note: event.note,
      })
      .returning(['id', 'created_at'])
      .executeTakeFirstOrThrow();
  }

  insertQuote(trx: Executor, values: Insertable<QuotesTable>) {
    return trx.insertInto('quotes').values(values).returningAll().executeTakeFirstOrThrow();
  }

  latestFirmQuote(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('quotes')
      .selectAll()
      .where('booking_id', '=', bookingId)
      .where('kind', '=', 'firm')
      .orderBy('created_at', 'desc')
      .limit(1)
      .executeTakeFirst();
  }

  payments(trx: Executor, bookingId: string) {
    return trx.selectFrom('payments').selectAll().where('booking_id', '=', bookingId).orderBy('created_at').execute();
  }

  approvedExtrasTotal(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('booking_extras')
      .select(sql<string>`coalesce(sum(amount), 0)::text`.as('total'))
      .where('booking_id', '=', bookingId)
      .where('status', '=', 'approved')
      .executeTakeFirstOrThrow();
  }

  builderByUser(trx: Executor, userId: string) {
    return trx.selectFrom('builders').select(['id', 'level']).where('user_id', '=', userId).executeTakeFirst();
  }

  builderRef(trx: Executor, builderId: string) {
    return trx
      .selectFrom('builders')
      .innerJoin('users', 'users.id', 'builders.user_id')
      .select(['builders.id', 'builders.user_id', 'users.name', 'builders.level'])
      .where('builders.id', '=', builderId)
      .executeTakeFirst();
  }

  insertTimeEntry(trx: Executor, values: { bookingId: string; builderId: string; workedOn: string; hours: string; note: string }) {
    return trx
      .insertInto('time_entries')
      .values({ booking_id: values.bookingId, builder_id: values.builderId, worked_on: values.workedOn, hours: values.hours, note: values.note })
      .returning('id')
      .executeTakeFirstOrThrow();
  }

  timeEntries(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('time_entries as t')
      .innerJoin('builders as b', 'b.id', 't.builder_id')
      .innerJoin('users as u', 'u.id', 'b.user_id')
      .select(['t.id', 't.worked_on', 't.hours', 't.note', 't.created_at', 'b.id as builder_id', 'b.user_id', 'b.level', 'u.name'])
      .where('t.booking_id', '=', bookingId)
      .orderBy('t.worked_on')
      .orderBy('t.created_at')
      .execute();
  }

  insertIntakeItems(trx: Executor, bookingId: string, recordedBy: string, items: Array<{ item: string; condition: 'working' | 'faulty'; note: string }>) {
    return trx
      .insertInto('intake_items')
      .values(items.map((i) => ({ booking_id: bookingId, recorded_by: recordedBy, item: i.item, condition: i.condition, note: i.note })))
      .returning('id')
      .execute();
  }

  intakeItems(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('intake_items as i')
      .innerJoin('users as u', 'u.id', 'i.recorded_by')
      .select(['i.id', 'i.item', 'i.condition', 'i.note', 'i.created_at', 'u.name as recorded_by'])
      .where('i.booking_id', '=', bookingId)
      .orderBy('i.created_at')
      .orderBy('i.item')
      .execute();
  }

  insertExtra(trx: Executor, values: { bookingId: string; description: string; amount: string; reason: string; proposedBy: string }) {
    return trx
      .insertInto('booking_extras')
      .values({
        booking_id: values.bookingId,
        description: values.description,
        amount: values.amount,
        reason: values.reason,
        status: 'proposed',
        proposed_by: values.proposedBy,
      })
      .returningAll()
      .executeTakeFirstOrThrow();
  }

  lockExtra(trx: Executor, bookingId: string, extraId: string) {
    return trx.selectFrom('booking_extras').selectAll().where('id', '=', extraId).where('booking_id', '=', bookingId).forUpdate().executeTakeFirst();
  }

  decideExtra(trx: Executor, extraId: string, status: 'approved' | 'declined') {
    return trx
      .updateTable('booking_extras')
      .set({ status, decided_at: sql`now()` })
      .where('id', '=', extraId)
      .where('status', '=', 'proposed')
      .returningAll()
      .executeTakeFirst();
  }

  extras(trx: Executor, bookingId: string) {
    return trx.selectFrom('booking_extras').selectAll().where('booking_id', '=', bookingId).orderBy('created_at').execute();
  }
}

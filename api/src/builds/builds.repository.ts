import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database, Executor, type DecidedVia } from '../database/database';

/** The columns an answer to an extra or a layout writes: the same for both kinds of approval. */
function decisionColumns(decision: Decision) {
  return {
    status: decision.approve ? ('approved' as const) : ('declined' as const),
    decided_at: sql<Date>`now()`,
    decided_via: decision.via,
    decided_by_name: decision.givenBy,
    decision_comment: decision.comment,
    recorded_by: decision.recordedBy,
  };
}

@Injectable()
export class BuildsRepository {
  constructor(private readonly db: Database) {}

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

  insertTimeEntry(
    trx: Executor,
    values: { bookingId: string; builderId: string; workedOn: string; hours: string; note: string; createdBy: string },
  ) {
    return trx
      .insertInto('time_entries')
      .values({
        booking_id: values.bookingId,
        builder_id: values.builderId,
        worked_on: values.workedOn,
        hours: values.hours,
        note: values.note,
        created_by: values.createdBy,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
  }

  /**
   * Hour entries with who worked them and who wrote them down, as every reader names them: `t` the entry,
   * `tb` the builder's row, `tu` the builder's account, `w` the account that recorded it. Callers add columns.
   */
  timeEntriesWithPeople(trx: Executor = this.db) {
    return trx
      .selectFrom('time_entries as t')
      .innerJoin('builders as tb', 'tb.id', 't.builder_id')
      .innerJoin('users as tu', 'tu.id', 'tb.user_id')
      .leftJoin('users as w', 'w.id', 't.created_by');
  }

  timeEntries(trx: Executor, bookingId: string) {
    return this.timeEntriesWithPeople(trx)
      .select([
        't.id',
        't.worked_on',
        't.hours',
        't.note',
        't.created_at',
        't.updated_at',
        't.created_by',
        'w.name as created_by_name',
        'tb.id as builder_id',
        'tb.user_id',
        'tb.level',
        'tu.name',
      ])
      .where('t.booking_id', '=', bookingId)
      .orderBy('t.worked_on')
      .orderBy('t.created_at')
      .execute();
  }

  lockTimeEntry(trx: Executor, bookingId: string, entryId: string) {
    return trx
      .selectFrom('time_entries')
      .selectAll()
      .where('id', '=', entryId)
      .where('booking_id', '=', bookingId)
      .forUpdate()
      .executeTakeFirst();
  }

  updateTimeEntry(trx: Executor, entryId: string, values: { worked_on: string; hours: string; note: string }) {
    return trx
      .updateTable('time_entries')
      .set({ ...values, updated_at: sql`now()` })
      .where('id', '=', entryId)
      .executeTakeFirstOrThrow();
  }

  deleteTimeEntry(trx: Executor, entryId: string) {
    return trx.deleteFrom('time_entries').where('id', '=', entryId).executeTakeFirstOrThrow();
  }

  /** Intake rows of a booking by their place in the rig, locked: a second recording waits for the first. */
  lockIntakeItems(trx: Executor, bookingId: string) {
    return trx.selectFrom('intake_items').selectAll().where('booking_id', '=', bookingId).forUpdate().execute();
  }

  insertIntakeItem(
    trx: Executor,
    values: {
      bookingId: string;
      key: string;
      position: number;
      item: string;
      condition: 'working' | 'faulty';
      note: string;
      recordedBy: string;
    },
  ) {
    return trx
      .insertInto('intake_items')
      .values({
        booking_id: values.bookingId,
        item_key: values.key,
        position: values.position,
        item: values.item,
        condition: values.condition,
        note: values.note,
        recorded_by: values.recordedBy,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
  }

  updateIntakeItem(trx: Executor, id: string, values: { item: string; condition: 'working' | 'faulty'; note: string; updatedBy: string }) {
    return trx
      .updateTable('intake_items')
      .set({ item: values.item, condition: values.condition, note: values.note, updated_by: values.updatedBy, updated_at: sql`now()` })
      .where('id', '=', id)
      .executeTakeFirstOrThrow();
  }

  intakeItems(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('intake_items as i')
      .innerJoin('users as u', 'u.id', 'i.recorded_by')
      .select(['i.id', 'i.item_key', 'i.item', 'i.condition', 'i.note', 'i.created_at', 'i.updated_at', 'u.name as recorded_by'])
      .where('i.booking_id', '=', bookingId)
      .orderBy('i.position')
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
      .returning('id')
      .executeTakeFirstOrThrow();
  }

  lockExtra(trx: Executor, bookingId: string, extraId: string) {
    return trx
      .selectFrom('booking_extras')
      .selectAll()
      .where('id', '=', extraId)
      .where('booking_id', '=', bookingId)
      .forUpdate()
      .executeTakeFirst();
  }

  decideExtra(trx: Executor, extraId: string, decision: Decision) {
    return trx
      .updateTable('booking_extras')
      .set(decisionColumns(decision))
      .where('id', '=', extraId)
      .where('status', '=', 'proposed')
      .executeTakeFirst();
  }

  insertLayoutApproval(trx: Executor, values: { bookingId: string; requestedBy: string; message: string }) {
    return trx
      .insertInto('layout_approvals')
      .values({ booking_id: values.bookingId, requested_by: values.requestedBy, message: values.message })
      .returning('id')
      .executeTakeFirstOrThrow();
  }

  lockWaitingLayout(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('layout_approvals')
      .selectAll()
      .where('booking_id', '=', bookingId)
      .where('status', '=', 'waiting')
      .forUpdate()
      .executeTakeFirst();
  }

  decideLayout(trx: Executor, id: string, decision: Decision) {
    return trx
      .updateTable('layout_approvals')
      .set(decisionColumns(decision))
      .where('id', '=', id)
      .where('status', '=', 'waiting')
      .executeTakeFirst();
  }
}

/** A yes or no, by the player in the app or recorded by staff with who said it and how. */
export interface Decision {
  approve: boolean;
  via: DecidedVia;
  givenBy: string;
  comment: string;
  recordedBy: string | null;
}

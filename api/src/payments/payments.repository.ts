import { Injectable } from '@nestjs/common';
import { sql, type Insertable, type Selectable, type Updateable } from 'kysely';
import { Database, type Executor, type PaymentsTable } from '../database/database';

export type PaymentRow = Selectable<PaymentsTable>;

@Injectable()
export class PaymentsRepository {
  constructor(private readonly db: Database) {}

  /** Newest first: the open attempt, if any, comes before the ones it replaced. */
  listForBooking(trx: Executor, bookingId: string, kind?: PaymentRow['kind']) {
    let q = trx.selectFrom('payments').selectAll().where('booking_id', '=', bookingId);
    if (kind) q = q.where('kind', '=', kind);
    return q.orderBy('created_at', 'desc').orderBy('id').execute();
  }

  insert(trx: Executor, values: Insertable<PaymentsTable>) {
    return trx.insertInto('payments').values(values).returningAll().executeTakeFirstOrThrow();
  }

  update(trx: Executor, id: string, patch: Updateable<PaymentsTable>) {
    return (
      trx
        .updateTable('payments')
        // Generated<Timestamp> hides the writable type of updated_at, hence the cast.
        .set({ ...patch, updated_at: sql`now()` } as unknown as Updateable<PaymentsTable>)
        .where('id', '=', id)
        .returningAll()
        .executeTakeFirstOrThrow()
    );
  }

  lockBySession(trx: Executor, sessionId: string) {
    return trx.selectFrom('payments').selectAll().where('checkout_session_id', '=', sessionId).forUpdate().executeTakeFirst();
  }

  lockById(trx: Executor, id: string) {
    return trx.selectFrom('payments').selectAll().where('id', '=', id).forUpdate().executeTakeFirst();
  }

  lockByIntent(trx: Executor, intentId: string) {
    return trx.selectFrom('payments').selectAll().where('payment_intent_id', '=', intentId).forUpdate().executeTakeFirst();
  }

  /**
   * Records a provider event id once. A concurrent duplicate waits on the primary key until the
   * first commits, then inserts nothing: the caller sees `false` and changes nothing.
   */
  async recordEvent(trx: Executor, event: { id: string; type: string; payload: unknown }): Promise<boolean> {
    const row = await trx
      .insertInto('payment_events')
      .values({ event_id: event.id, type: event.type, payload: JSON.stringify(event.payload) })
      .onConflict((oc) => oc.column('event_id').doNothing())
      .returning('event_id')
      .executeTakeFirst();
    return row !== undefined;
  }

  /** Who hears of money trouble at once: every owner account, else the shop's contact address. */
  async ownerAddresses(trx: Executor): Promise<string[]> {
    const owners = await trx.selectFrom('users').select('email').where('role', '=', 'owner').orderBy('email').execute();
    if (owners.length > 0) return owners.map((o) => o.email);
    const shop = await trx.selectFrom('shop_settings').select('contact_email').executeTakeFirst();
    return shop ? [shop.contact_email] : [];
  }

  findCustomer(trx: Executor, userId: string) {
    return trx.selectFrom('users').select(['id', 'name', 'email']).where('id', '=', userId).executeTakeFirstOrThrow();
  }

  /** The payment that carries a provider intent id, if any. */
  idOfIntent(intentId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('payments')
      .select('id')
      .where('payment_intent_id', '=', intentId)
      .executeTakeFirst()
      .then((r) => r?.id);
  }

  /** How many payments there are of each kind and status (the metrics' gauge). */
  countsByKindAndStatus(trx: Executor = this.db) {
    return trx
      .selectFrom('payments')
      .select(['kind', 'status', (eb) => eb.fn.countAll<string>().as('n')])
      .groupBy(['kind', 'status'])
      .execute();
  }
}

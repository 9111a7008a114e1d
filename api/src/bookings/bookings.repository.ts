import { Injectable } from '@nestjs/common';
import { sql, type Insertable, type Selectable, type SelectQueryBuilder, type Updateable } from 'kysely';
import type {
  BookingEventsTable,
  BookingExtrasTable,
  BookingsTable,
  DB,
  Executor,
  LayoutApprovalsTable,
  PaymentsTable,
  PhotosTable,
  QuotesTable,
} from '../database/database';
import { Database } from '../database/database';
import { flip, fromTheEnd } from '../database/list-paging';
import type { BookingState, DepositStatus } from '@loomwright/shared';

export type BookingRow = Selectable<BookingsTable>;
export type QuoteRow = Selectable<QuotesTable>;
export type PaymentRow = Selectable<PaymentsTable>;
export type BookingEventRow = Selectable<BookingEventsTable>;
export type PhotoRow = Selectable<PhotosTable>;
export type ExtraRow = Selectable<BookingExtrasTable> & { recorded_by_name: string | null };
export type LayoutApprovalRow = Selectable<LayoutApprovalsTable> & { recorded_by_name: string | null; requested_by_name: string | null };

export type QuoteSummaryRow = Pick<
  QuoteRow,
  'id' | 'booking_id' | 'kind' | 'currency' | 'labor_hours' | 'total_low' | 'total_high' | 'deposit' | 'total' | 'created_at'
>;

export interface BookingListRow extends BookingRow {
  customer_name: string;
  customer_email: string;
  builder_user_id: string | null;
  builder_name: string | null;
  builder_level: string | null;
  deposit_status: DepositStatus;
}

export interface BookingListQuery {
  customerId?: string;
  state?: string;
  depositStatus?: string;
  q?: string;
  /**
   * A builder's search matches references and names, never addresses: an address they may not see
   * (see customerContactMiddleware in customer-contact.middleware.ts) must not be findable either, unless the build is theirs.
   */
  emailSearchForBuilderUserId?: string;
  sort: 'created_at' | 'updated_at' | 'reference' | 'state' | 'bench_date';
  order: 'asc' | 'desc';
  limit: number;
  offset: number;
  /** Keyset paging: the rows after this one in the list's order (then `offset` is not used). */
  after?: { key: string | null; id: string };
}

/**
 * The rows after `after` in the list's order (sort column, then id, both one way). On a column that
 * is never null a row comparison, which the (column, id) index answers directly; `bench_date` may be
 * null, and PostgreSQL puts nulls last going up and first going down.
 */
function afterRow(sort: BookingListQuery['sort'], order: 'asc' | 'desc', after: { key: string | null; id: string }) {
  const col = sql.ref(`bookings.${sort}`);
  const id = sql.ref('bookings.id');
  const cmp = sql.raw(order === 'asc' ? '>' : '<');
  if (sort !== 'bench_date') return sql<boolean>`(${col}, ${id}) ${cmp} (${after.key}, ${after.id}::uuid)`;
  if (after.key === null) {
    return order === 'asc'
      ? sql<boolean>`(${col} is null and ${id} > ${after.id}::uuid)`
      : sql<boolean>`(${col} is not null or ${id} < ${after.id}::uuid)`;
  }
  const tail = order === 'asc' ? sql` or ${col} is null` : sql``;
  return sql<boolean>`((${col}, ${id}) ${cmp} (${after.key}::date, ${after.id}::uuid)${tail})`;
}

/**
 * A booking's deposit in one word, worked out from its payment rows: paid wins over an open checkout,
 * and a dispute the bank has not decided for the shop shows first (the money may not stay). Lists
 * read the word kept on the booking row (`bookings.deposit_status`, written by a trigger on payments,
 * migration 20261202_1345); this is the definition it must always agree with, for checks.
 */
export const depositStatusFromPaymentsSql = sql<DepositStatus>`(
  case
    when exists (select 1 from payments p where p.booking_id = bookings.id and p.kind = 'deposit' and p.dispute_id is not null
                 and p.dispute_status not in ('won', 'warning_closed')) then 'disputed'
    when exists (select 1 from payments p where p.booking_id = bookings.id and p.kind = 'deposit' and p.status = 'paid') then 'paid'
    when exists (select 1 from payments p where p.booking_id = bookings.id and p.kind = 'deposit' and p.status = 'refunded') then 'refunded'
    when exists (select 1 from payments p where p.booking_id = bookings.id and p.kind = 'deposit' and p.status = 'processing') then 'processing'
    when exists (select 1 from payments p where p.booking_id = bookings.id and p.kind = 'deposit' and p.status = 'pending') then 'pending'
    else 'unpaid'
  end)`;

/**
 * The hours a build is quoted for, as a column of a query over bookings (`booking` names its id column):
 * the newest firm quote's, else the estimate's. The one form of "latest quote" for lists and reports.
 */
export const quotedHoursOf = (booking: string) =>
  sql<string | null>`coalesce(
    (select q.labor_hours::text from quotes q where q.booking_id = ${sql.ref(booking)} and q.kind = 'firm' order by q.created_at desc, q.id desc limit 1),
    (select q.labor_hours::text from quotes q where q.booking_id = ${sql.ref(booking)} and q.kind = 'estimate' order by q.created_at desc, q.id desc limit 1))`;

@Injectable()
export class BookingsRepository {
  constructor(private readonly db: Database) {}

  async nextReference(trx: Executor = this.db): Promise<string> {
    const { rows } = await sql<{ n: string }>`select nextval('booking_reference_seq')::text as n`.execute(trx);
    return `LW-${rows[0].n}`;
  }

  insertBooking(trx: Executor, values: Insertable<BookingsTable>) {
    return trx.insertInto('bookings').values(values).returningAll().executeTakeFirstOrThrow();
  }

  insertQuote(trx: Executor, values: Insertable<QuotesTable>) {
    return trx.insertInto('quotes').values(values).returningAll().executeTakeFirstOrThrow();
  }

  insertEvent(trx: Executor, values: Insertable<BookingEventsTable>) {
    return trx.insertInto('booking_events').values(values).returningAll().executeTakeFirstOrThrow();
  }

  /** The newest quote of a booking, of one kind or of either (a firm quote is newer than the estimate it replaced). */
  latestQuote(trx: Executor, bookingId: string, kind?: QuoteRow['kind']) {
    return trx
      .selectFrom('quotes')
      .selectAll()
      .where('booking_id', '=', bookingId)
      .$if(kind !== undefined, (q) => q.where('kind', '=', kind!))
      .orderBy('created_at', 'desc')
      .orderBy('kind', 'desc')
      .limit(1)
      .executeTakeFirst();
  }

  /** The booking row with its player's name and address, locked until the transaction ends: one change to a booking at a time. */
  lockWithCustomer(trx: Executor, id: string) {
    return trx
      .selectFrom('bookings as b')
      .innerJoin('users as c', 'c.id', 'b.customer_id')
      .selectAll('b')
      .select(['c.name as customer_name', 'c.email as customer_email'])
      .where('b.id', '=', id)
      .forUpdate('b')
      .executeTakeFirst();
  }

  /** Changes the row only if its state is still one of `from` (the lock makes this certain; the guard documents it). */
  updateIfIn(trx: Executor, id: string, from: BookingState[], patch: Updateable<BookingsTable>) {
    return trx
      .updateTable('bookings')
      .set({ ...patch, updated_at: sql`now()` } as unknown as Updateable<BookingsTable>)
      .where('id', '=', id)
      .where('state', 'in', from)
      .returningAll()
      .executeTakeFirst();
  }

  /**
   * Bookings with their people, as every reader names them: `b` the booking, `c` its player, `bl` its
   * builder's row and `bu` the builder's account (both null before acceptance). Callers add columns and filters.
   */
  withPeople(trx: Executor = this.db) {
    return trx
      .selectFrom('bookings as b')
      .innerJoin('users as c', 'c.id', 'b.customer_id')
      .leftJoin('builders as bl', 'bl.id', 'b.builder_id')
      .leftJoin('users as bu', 'bu.id', 'bl.user_id');
  }

  /** `withPeople` with the columns every list names a booking by: its id, reference and state, and its player's name. */
  withPeopleNamed(trx: Executor = this.db) {
    return this.withPeople(trx).select(['b.id', 'b.reference', 'b.state', 'c.name as customer_name']);
  }

  findById(id: string, trx: Executor = this.db) {
    return trx.selectFrom('bookings').selectAll().where('id', '=', id).executeTakeFirst();
  }

  /** Row lock held until the caller's transaction ends: state changes on one booking queue up. */
  lockById(trx: Executor, id: string) {
    return trx.selectFrom('bookings').selectAll().where('id', '=', id).forUpdate().executeTakeFirst();
  }

  update(trx: Executor, id: string, patch: Updateable<BookingsTable>) {
    return (
      trx
        .updateTable('bookings')
        // Generated<Timestamp> hides the writable type of updated_at, hence the cast.
        .set({ ...patch, updated_at: sql`now()` } as unknown as Updateable<BookingsTable>)
        .where('id', '=', id)
        .returningAll()
        .executeTakeFirstOrThrow()
    );
  }

  /**
   * The list's filters, written on `bookings` alone so the count needs no join and each can use an
   * index: the search is a union of the reference's and the customers' trigram matches (an OR across
   * two joined tables could only be a full scan); the deposit filter reads the word kept on the
   * booking (bookings_deposit_created_idx).
   */
  private filtered<QB extends SelectQueryBuilder<DB, 'bookings', object>>(
    qb: QB,
    trx: Executor,
    query: Omit<BookingListQuery, 'sort' | 'order' | 'limit' | 'offset'>,
  ): QB {
    let out = qb;
    if (query.customerId) out = out.where('bookings.customer_id', '=', query.customerId) as QB;
    if (query.state) out = out.where('bookings.state', '=', query.state as BookingRow['state']) as QB;
    if (query.depositStatus) out = out.where('bookings.deposit_status', '=', query.depositStatus as DepositStatus) as QB;
    if (query.q) {
      const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      const customers = (column: 'name' | 'email') =>
        trx
          .selectFrom('users as u')
          .select('u.id')
          .where(column === 'name' ? sql.ref('u.name') : sql`u.email::text`, 'ilike', pattern);
      const builderOnly = query.emailSearchForBuilderUserId;
      // A builder finds a customer by e-mail only on their own builds (the address is hidden on the others).
      const byEmail = trx
        .selectFrom('bookings as e')
        .select('e.id')
        .where('e.customer_id', 'in', customers('email'))
        .$if(!!builderOnly, (qb) =>
          qb.where('e.builder_id', 'in', trx.selectFrom('builders as w').select('w.id').where('w.user_id', '=', builderOnly!)),
        );
      const matches = trx
        .selectFrom('bookings as r')
        .select('r.id')
        .where('r.reference', 'ilike', pattern)
        .unionAll(trx.selectFrom('bookings as n').select('n.id').where('n.customer_id', 'in', customers('name')))
        .unionAll(byEmail);
      out = out.where('bookings.id', 'in', matches) as QB;
    }
    return out;
  }

  /**
   * A list row: the booking (its deposit word included) with its customer and builder. The builder is
   * found by key for each row (a lateral subquery with a limit, which PostgreSQL keeps as a loop):
   * a plain join made the planner hash every user in the shop to name some twenty builders.
   */
  private listRows(trx: Executor) {
    return trx
      .selectFrom('bookings')
      .innerJoin('users as customer', 'customer.id', 'bookings.customer_id')
      .leftJoinLateral(
        (eb) =>
          eb
            .selectFrom('builders')
            .innerJoin('users', 'users.id', 'builders.user_id')
            .select(['users.id as user_id', 'users.name', 'builders.level'])
            .whereRef('builders.id', '=', 'bookings.builder_id')
            .limit(1)
            .as('builder'),
        (join) => join.onTrue(),
      )
      .selectAll('bookings')
      .select([
        'customer.name as customer_name',
        'customer.email as customer_email',
        'builder.user_id as builder_user_id',
        'builder.name as builder_name',
        'builder.level as builder_level',
      ]);
  }

  async list(
    query: BookingListQuery,
    trx: Executor = this.db,
  ): Promise<{ rows: Array<BookingListRow & { sort_key: string | null }>; total: number }> {
    const count = () =>
      this.filtered(trx.selectFrom('bookings'), trx, query)
        .select((eb) => eb.fn.countAll<string>().as('total'))
        .executeTakeFirstOrThrow()
        .then((r) => Number(r.total));
    // The id breaks ties in the same direction as the sort, so one index (sort column, id) serves both orders.
    // The page's ids are found first on bookings alone: rows skipped by OFFSET are then only index
    // entries, never joined rows.
    const page = (reverse: boolean, limit: number, offset: number) => {
      const ids = this.filtered(trx.selectFrom('bookings'), trx, query)
        .select('bookings.id')
        .orderBy(`bookings.${query.sort}`, flip(query.order, reverse))
        .orderBy('bookings.id', flip(query.order, reverse))
        .limit(limit);
      return (
        this.listRows(trx)
          // The sort value as PostgreSQL writes it (microseconds kept), for the next page's cursor.
          .select(sql<string | null>`${sql.ref(`bookings.${query.sort}`)}::text`.as('sort_key'))
          .where('bookings.id', 'in', query.after ? ids.where(afterRow(query.sort, query.order, query.after)) : ids.offset(offset))
          .orderBy(`bookings.${query.sort}`, query.order)
          .orderBy('bookings.id', query.order)
          .execute() as Promise<Array<BookingListRow & { sort_key: string | null }>>
      );
    };
    if (query.after || query.offset === 0) {
      // Count and page need nothing from each other: on the pool they run side by side.
      const [total, rows] = await Promise.all([count(), page(false, query.limit, query.offset)]);
      return { rows, total };
    }
    const total = await count();
    const far = fromTheEnd(total, query.offset, query.limit);
    const rows = far ? await page(true, far.limit, far.offset) : await page(false, query.limit, query.offset);
    return { rows, total };
  }

  async findListRow(id: string, trx: Executor = this.db): Promise<BookingListRow | undefined> {
    const row = await this.listRows(trx).where('bookings.id', '=', id).executeTakeFirst();
    return row as BookingListRow | undefined;
  }

  /** What a list row shows of its quotes: the figures, never the engine's whole answer or the configuration. */
  quoteSummariesFor(bookingIds: string[], trx: Executor = this.db): Promise<QuoteSummaryRow[]> {
    if (bookingIds.length === 0) return Promise.resolve([]);
    return trx
      .selectFrom('quotes')
      .select(['id', 'booking_id', 'kind', 'currency', 'labor_hours', 'total_low', 'total_high', 'deposit', 'total', 'created_at'])
      .where('booking_id', 'in', bookingIds)
      .orderBy('created_at')
      .orderBy('id')
      .execute();
  }

  quotesFor(bookingIds: string[], trx: Executor = this.db): Promise<QuoteRow[]> {
    if (bookingIds.length === 0) return Promise.resolve([]);
    return trx.selectFrom('quotes').selectAll().where('booking_id', 'in', bookingIds).orderBy('created_at').orderBy('id').execute();
  }

  paymentsFor(bookingId: string, trx: Executor = this.db): Promise<PaymentRow[]> {
    return trx.selectFrom('payments').selectAll().where('booking_id', '=', bookingId).orderBy('created_at').execute();
  }

  eventsFor(bookingId: string, trx: Executor = this.db): Promise<BookingEventRow[]> {
    return trx.selectFrom('booking_events').selectAll().where('booking_id', '=', bookingId).orderBy('id').execute();
  }

  photosFor(bookingId: string, trx: Executor = this.db): Promise<PhotoRow[]> {
    // A message's photos belong to its thread, not to the booking's photo list.
    return trx
      .selectFrom('photos')
      .selectAll()
      .where('booking_id', '=', bookingId)
      .where('message_id', 'is', null)
      .orderBy('created_at')
      .execute();
  }

  extrasFor(bookingId: string, trx: Executor = this.db): Promise<ExtraRow[]> {
    return trx
      .selectFrom('booking_extras as x')
      .leftJoin('users as r', 'r.id', 'x.recorded_by')
      .selectAll('x')
      .select('r.name as recorded_by_name')
      .where('x.booking_id', '=', bookingId)
      .orderBy('x.created_at')
      .orderBy('x.id')
      .execute();
  }

  layoutApprovalsFor(bookingId: string, trx: Executor = this.db): Promise<LayoutApprovalRow[]> {
    return trx
      .selectFrom('layout_approvals as l')
      .leftJoin('users as r', 'r.id', 'l.recorded_by')
      .leftJoin('users as q', 'q.id', 'l.requested_by')
      .selectAll('l')
      .select(['r.name as recorded_by_name', 'q.name as requested_by_name'])
      .where('l.booking_id', '=', bookingId)
      .orderBy('l.created_at')
      .orderBy('l.id')
      .execute();
  }

  countPhotos(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('photos')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('booking_id', '=', bookingId)
      .where('message_id', 'is', null)
      .executeTakeFirstOrThrow()
      .then((r) => Number(r.n));
  }

  insertPhoto(trx: Executor, values: Insertable<PhotosTable>) {
    return trx.insertInto('photos').values(values).returningAll().executeTakeFirstOrThrow();
  }

  /** Points a photo stored before re-encoding at its re-encoded copies; only the first caller wins. */
  replaceLegacyPhoto(
    photoId: string,
    values: { storage_key: string; thumbnail_key: string; content_type: string; size_bytes: number; width: number; height: number },
    trx: Executor = this.db,
  ) {
    return trx
      .updateTable('photos')
      .set(values)
      .where('id', '=', photoId)
      .where('thumbnail_key', 'is', null)
      .returningAll()
      .executeTakeFirst();
  }

  findPhoto(bookingId: string, photoId: string, trx: Executor = this.db) {
    return trx.selectFrom('photos').selectAll().where('booking_id', '=', bookingId).where('id', '=', photoId).executeTakeFirst();
  }
}

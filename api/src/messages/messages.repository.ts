import { Injectable } from '@nestjs/common';
import { sql, type Insertable } from 'kysely';
import type { MessageSide } from '@loomwright/shared';
import { BookingsRepository } from '../bookings/bookings.repository';
import { Database, type Executor, type PhotosTable } from '../database/database';

const otherSide = (side: MessageSide): MessageSide => (side === 'player' ? 'shop' : 'player');

@Injectable()
export class MessagesRepository {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsRepository,
  ) {}

  /** The user id of the builder a booking is assigned to, if any. */
  async assignedBuilderUserId(bookingId: string, trx: Executor = this.db): Promise<string | null> {
    const row = await this.bookings.withPeople(trx).select('bl.user_id').where('b.id', '=', bookingId).executeTakeFirst();
    return row?.user_id ?? null;
  }

  insertMessage(trx: Executor, values: { booking_id: string; author_id: string; side: MessageSide; body: string; created_at: Date }) {
    return trx.insertInto('build_messages').values(values).returning(['id', 'seq', 'created_at']).executeTakeFirstOrThrow();
  }

  /** A message's photo is a row of the booking's photos (the bookings repository writes them). */
  insertPhoto(trx: Executor, values: Insertable<PhotosTable>) {
    return this.bookings.insertPhoto(trx, values);
  }

  thread(bookingId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('build_messages')
      .innerJoin('users', 'users.id', 'build_messages.author_id')
      .select([
        'build_messages.id',
        'build_messages.seq',
        'build_messages.side',
        'build_messages.body',
        'build_messages.created_at',
        'build_messages.author_id',
        'users.name as author_name',
      ])
      .where('build_messages.booking_id', '=', bookingId)
      .orderBy('build_messages.seq')
      .execute();
  }

  photosOfMessages(messageIds: string[], trx: Executor = this.db) {
    if (messageIds.length === 0) return Promise.resolve([]);
    return trx
      .selectFrom('photos')
      .select(['id', 'booking_id', 'message_id', 'width', 'height'])
      .where('message_id', 'in', messageIds)
      .orderBy('created_at')
      .orderBy('id')
      .execute();
  }

  /** Moves a side's read marker forward to `seq` (never back: a slow reader cannot un-read newer messages). */
  markRead(trx: Executor, bookingId: string, side: MessageSide, seq: string, at: Date) {
    return trx
      .insertInto('message_read_markers')
      .values({ booking_id: bookingId, side, read_seq: seq, read_at: at })
      .onConflict((oc) =>
        oc.columns(['booking_id', 'side']).doUpdateSet({
          read_seq: sql`greatest(message_read_markers.read_seq, excluded.read_seq)`,
          read_at: sql`case when excluded.read_seq > message_read_markers.read_seq then excluded.read_at else message_read_markers.read_at end`,
        }),
      )
      .execute();
  }

  async readSeq(bookingId: string, side: MessageSide, trx: Executor = this.db): Promise<string> {
    const row = await trx
      .selectFrom('message_read_markers')
      .select('read_seq')
      .where('booking_id', '=', bookingId)
      .where('side', '=', side)
      .executeTakeFirst();
    return row?.read_seq ?? '0';
  }

  /**
   * Unread messages for `side`, per booking: those the other side wrote after the side's marker.
   * `bookings` narrows to one player's bookings or one builder's assigned builds.
   */
  unreadFor(side: MessageSide, scope: { customerId?: string; builderUserId?: string; bookingId?: string }, trx: Executor = this.db) {
    let query = trx
      .selectFrom('build_messages as m')
      .innerJoin('bookings as b', 'b.id', 'm.booking_id')
      .leftJoin('message_read_markers as r', (join) => join.onRef('r.booking_id', '=', 'm.booking_id').on('r.side', '=', side))
      .select(['b.id as booking_id', 'b.reference', (eb) => eb.fn.countAll<string>().as('unread')])
      .where('m.side', '=', otherSide(side))
      .where(sql<boolean>`m.seq > coalesce(r.read_seq, 0)`)
      .groupBy(['b.id', 'b.reference'])
      .orderBy('b.reference');
    if (scope.customerId) query = query.where('b.customer_id', '=', scope.customerId);
    if (scope.bookingId) query = query.where('b.id', '=', scope.bookingId);
    if (scope.builderUserId) {
      const builderUserId = scope.builderUserId;
      query = query.where('b.builder_id', 'in', (eb) => eb.selectFrom('builders').select('id').where('user_id', '=', builderUserId));
    }
    return query.execute();
  }

  /**
   * Opens the side's notice for a new message unless one is already waiting: the first message
   * sets the window, later ones join it.
   */
  openNotice(trx: Executor, bookingId: string, side: MessageSide, fromSeq: string, dueAt: Date) {
    return trx
      .insertInto('message_notices')
      .values({ booking_id: bookingId, side, from_seq: fromSeq, due_at: dueAt })
      .onConflict((oc) => oc.columns(['booking_id', 'side']).where('state', '=', 'waiting').doNothing())
      .returning(['id', 'due_at'])
      .executeTakeFirst();
  }

  /**
   * Claims due notices in the caller's transaction. `for update skip locked`: two processes that
   * look at once never claim the same notice; the loser sees no row and moves on.
   */
  claimDueNotices(trx: Executor, now: Date, limit: number) {
    return trx
      .selectFrom('message_notices')
      .selectAll()
      .where('state', '=', 'waiting')
      .where('due_at', '<=', now)
      .orderBy('due_at')
      .limit(limit)
      .forUpdate()
      .skipLocked()
      .execute();
  }

  settleNotice(
    trx: Executor,
    id: string,
    values: { state: 'sent' | 'skipped'; message_count: number; outbox_id: string | null; settled_at: Date },
  ) {
    return trx.updateTable('message_notices').set(values).where('id', '=', id).where('state', '=', 'waiting').executeTakeFirst();
  }

  /** The messages a notice tells of: written by the other side from its first one, still unread by the recipient's side. */
  noticeMessages(trx: Executor, bookingId: string, recipientSide: MessageSide, fromSeq: string) {
    return trx
      .selectFrom('build_messages as m')
      .innerJoin('users as u', 'u.id', 'm.author_id')
      .leftJoin('message_read_markers as r', (join) => join.onRef('r.booking_id', '=', 'm.booking_id').on('r.side', '=', recipientSide))
      .select([
        'm.id',
        'm.body',
        'm.created_at',
        'u.name as author_name',
        (eb) =>
          eb
            .selectFrom('photos')
            .select((e) => e.fn.countAll<string>().as('n'))
            .whereRef('photos.message_id', '=', 'm.id')
            .as('photo_count'),
      ])
      .where('m.booking_id', '=', bookingId)
      .where('m.side', '=', otherSide(recipientSide))
      .where('m.seq', '>=', fromSeq)
      .where(sql<boolean>`m.seq > coalesce(r.read_seq, 0)`)
      .orderBy('m.seq')
      .execute();
  }

  /** Who a notice goes to: the player, or the assigned builder (the shop's address while no builder has the build). */
  noticeRecipients(bookingId: string, trx: Executor = this.db) {
    return this.bookings
      .withPeople(trx)
      .select([
        'b.id',
        'b.reference',
        'c.id as customer_id',
        'c.name as customer_name',
        'c.email as customer_email',
        'bu.id as builder_user_id',
        'bu.name as builder_name',
        'bu.email as builder_email',
      ])
      .where('b.id', '=', bookingId)
      .executeTakeFirst();
  }
}

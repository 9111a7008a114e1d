import { randomUUID } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { singleUseLinkKeys, type MailState } from '@loomwright/shared';
import { Database, Executor } from '../database/database';
import { flip, fromTheEnd } from '../database/list-paging';
import type { OutgoingMail } from './mail.types';

export interface MailListFilter {
  page: number;
  pageSize: number;
  state?: MailState;
  q?: string;
  /** A builder's log: only messages to them, and messages about builds assigned to them. */
  onlyForBuilderUserId?: string;
  /** Keyset paging: the messages after this one, newest first (then `page` is not used). */
  after?: { key: string; id: string };
}

/**
 * The row's data without its single-use links: set in the same UPDATE that records a final state,
 * so there is no moment after sending when the state is final and the token still readable.
 */
const dataWithoutLinks = sql<string>`case template ${sql.join(
  Object.entries(singleUseLinkKeys).map(([template, keys]) => sql`when ${template} then data - ${[...keys]}::text[]`),
  sql` `,
)} else data end`;

@Injectable()
export class MailOutboxRepository {
  constructor(private readonly db: Database) {}

  /** Inserts into the outbox; returns undefined when the dedupe key was already used. */
  insert(mail: OutgoingMail, domain: string, trx: Executor = this.db) {
    return trx
      .insertInto('mail_outbox')
      .values({
        message_id: `<${randomUUID()}@${domain}>`,
        template: mail.template,
        to_address: mail.to,
        data: JSON.stringify(mail.data),
        booking_id: mail.bookingId ?? null,
        user_id: mail.userId ?? null,
        dedupe_key: mail.dedupeKey ?? null,
      })
      .onConflict((oc) => oc.column('dedupe_key').doNothing())
      .returning(['id', 'message_id'])
      .executeTakeFirst();
  }

  /**
   * A copy of a message under a new Message-ID, linked to the one it repeats. `data` replaces the
   * original's (a message with a single-use link gets a fresh link, never the spent one).
   */
  insertResend(originalId: string, domain: string, data: Record<string, unknown> | null, trx: Executor = this.db) {
    return trx
      .insertInto('mail_outbox')
      .columns(['message_id', 'template', 'to_address', 'data', 'booking_id', 'user_id', 'resent_from_id'])
      .expression(
        trx
          .selectFrom('mail_outbox')
          .select([
            sql<string>`${`<${randomUUID()}@${domain}>`}`.as('message_id'),
            'template',
            'to_address',
            data ? sql<string>`${JSON.stringify(data)}::jsonb`.as('data') : 'data',
            'booking_id',
            'user_id',
            'id',
          ])
          .where('id', '=', originalId),
      )
      .returning(['id', 'message_id'])
      .executeTakeFirst();
  }

  findById(id: string, trx: Executor = this.db) {
    return trx.selectFrom('mail_outbox').selectAll().where('id', '=', id).executeTakeFirst();
  }

  /**
   * The claim: queued → sending in one statement under a row lock. `for update skip locked`
   * means two senders that race for the same row never both get it: the loser sees no row.
   */
  async claim(id: string, trx: Executor = this.db) {
    return (await this.claimMany([id], trx)).at(0);
  }

  /**
   * The claim for many rows in one statement (a batch of the outbox; `claim` is a batch of one): each
   * row listed that is still queued and not locked by another sender moves to 'sending' and comes
   * back; a row another sender holds or has already taken is skipped.
   */
  claimMany(ids: string[], trx: Executor = this.db) {
    if (ids.length === 0) return Promise.resolve([]);
    return trx
      .updateTable('mail_outbox')
      .set({ state: 'sending', attempts: sql`attempts + 1`, claimed_at: sql`now()`, last_attempt_at: sql`now()` })
      .where('id', 'in', (eb) =>
        eb.selectFrom('mail_outbox').select('id').where('id', 'in', ids).where('state', '=', 'queued').forUpdate().skipLocked(),
      )
      .returningAll()
      .execute();
  }

  markSent(id: string, subject: string, trx: Executor = this.db) {
    return trx
      .updateTable('mail_outbox')
      .set({ state: 'sent', sent_at: sql`now()`, subject, last_error: null, claimed_at: null, data: dataWithoutLinks })
      .where('id', '=', id)
      .where('state', '=', 'sending')
      .executeTakeFirst();
  }

  /**
   * Ends a claim that did not end in 'sent': back in the queue for the next attempt, failed for
   * good, or of unknown outcome. Only 'queued' keeps the single-use links (the next try needs them).
   */
  release(id: string, state: 'queued' | 'failed' | 'unknown', error: string, subject: string | null, trx: Executor = this.db) {
    return trx
      .updateTable('mail_outbox')
      .set({
        state,
        last_error: error.slice(0, 2000),
        claimed_at: null,
        subject: sql`coalesce(${subject}, subject)`,
        ...(state === 'queued' ? {} : { data: dataWithoutLinks }),
      })
      .where('id', '=', id)
      .where('state', '=', 'sending')
      .executeTakeFirst();
  }

  /** Queued rows, oldest first (for "deliver everything now"). */
  queuedIds(limit: number, trx: Executor = this.db) {
    return trx
      .selectFrom('mail_outbox')
      .select('id')
      .where('state', '=', 'queued')
      .orderBy('created_at')
      .limit(limit)
      .execute()
      .then((rows) => rows.map((r) => r.id));
  }

  /**
   * Queued rows whose delivery job has evidently gone missing: still waiting well past the time
   * their next try was due (the retry delay doubled per attempt, plus a grace period).
   */
  overdueIds(retryDelaySeconds: number, graceSeconds: number, limit: number, trx: Executor = this.db) {
    return trx
      .selectFrom('mail_outbox')
      .select('id')
      .where('state', '=', 'queued')
      .where(
        // Never tried: its job should have run within seconds. Tried n times: pg-boss waits up to
        // retryDelay × 2^n before the next try.
        sql<boolean>`coalesce(last_attempt_at, created_at)
          + make_interval(secs => case when attempts = 0 then 0
              else ${retryDelaySeconds}::double precision * power(2, least(attempts, 12)) end + ${graceSeconds}::double precision)
          < now()`,
      )
      .orderBy('created_at')
      .limit(limit)
      .execute()
      .then((rows) => rows.map((r) => r.id));
  }

  /** Claims older than the lease whose sender stopped mid-send: their outcome is unknown. */
  markStaleClaimsUnknown(leaseSeconds: number, error: string, trx: Executor = this.db) {
    return trx
      .updateTable('mail_outbox')
      .set({ state: 'unknown', last_error: error, claimed_at: null, data: dataWithoutLinks })
      .where('state', '=', 'sending')
      .where(sql<boolean>`claimed_at < now() - make_interval(secs => ${leaseSeconds}::double precision)`)
      .returning('id')
      .execute();
  }

  async list(filter: MailListFilter, trx: Executor = this.db) {
    let query = trx.selectFrom('mail_outbox');
    if (filter.state) query = query.where('state', '=', filter.state);
    if (filter.q) query = query.where(sql<boolean>`lower(to_address) like ${`%${filter.q.toLowerCase().replace(/[\\%_]/g, '\\$&')}%`}`);
    const builderUserId = filter.onlyForBuilderUserId;
    if (builderUserId) {
      query = query.where((eb) =>
        eb.or([
          eb('user_id', '=', builderUserId),
          eb(
            'booking_id',
            'in',
            eb
              .selectFrom('bookings')
              .innerJoin('builders', 'builders.id', 'bookings.builder_id')
              .select('bookings.id')
              .where('builders.user_id', '=', builderUserId),
          ),
        ]),
      );
    }
    const count = () =>
      query
        .select((eb) => eb.fn.countAll<string>().as('total'))
        .executeTakeFirstOrThrow()
        .then((r) => Number(r.total));
    // Newest first, the id breaking ties the same way: one index (created_at desc, id desc) read either way.
    const page = (reverse: boolean, limit: number, offset: number) => {
      const order = flip('desc', reverse);
      let rows = query
        .selectAll()
        // The time as PostgreSQL writes it (microseconds kept), for the next page's cursor.
        .select(sql<string>`created_at::text`.as('sort_key'))
        .orderBy('created_at', order)
        .orderBy('id', order)
        .limit(limit);
      rows = filter.after
        ? rows.where(sql<boolean>`(created_at, id) < (${filter.after.key}::timestamptz, ${filter.after.id}::uuid)`)
        : rows.offset(offset);
      return rows.execute().then((found) => (reverse ? found.reverse() : found));
    };
    const offset = (filter.page - 1) * filter.pageSize;
    if (filter.after || offset === 0) {
      const [rows, total] = await Promise.all([page(false, filter.pageSize, offset), count()]);
      return { rows, total };
    }
    // A page past the middle is read from the oldest end (the last page skips nothing).
    const total = await count();
    const far = fromTheEnd(total, offset, filter.pageSize);
    const rows = far ? await page(true, far.limit, far.offset) : await page(false, filter.pageSize, offset);
    return { rows, total };
  }

  /** How many messages the outbox holds in each state (the metrics' gauge). */
  countsByState(trx: Executor = this.db) {
    return trx
      .selectFrom('mail_outbox')
      .select(['state', (eb) => eb.fn.countAll<string>().as('n')])
      .groupBy('state')
      .execute();
  }

  /** How many letters of one template a person was sent in the last hour (a resend does not count). */
  sentInLastHour(trx: Executor, userId: string, template: string) {
    return trx
      .selectFrom('mail_outbox')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('user_id', '=', userId)
      .where('template', '=', template)
      .where('created_at', '>', sql<Date>`now() - interval '1 hour'`)
      .where('resent_from_id', 'is', null)
      .executeTakeFirstOrThrow()
      .then((r) => Number(r.n));
  }
}

import { Injectable } from '@nestjs/common';
import { sql, type OrderByItemBuilder } from 'kysely';
import { Database, Executor } from '../database/database';
import type { CustomerSort } from '@loomwright/shared';

/** States in which a build is still with the shop or on its way there. */
const ACTIVE = ['requested', 'deposit_paid', 'scheduled', 'pedals_received', 'on_bench', 'testing', 'ready'];

@Injectable()
export class CustomersRepository {
  constructor(private readonly db: Database) {}

  /** Customers who match the search, each joined with their bookings and grouped (for the summaries). */
  private base(trx: Executor, search?: string, searchEmail = true) {
    return this.matching(trx, search, searchEmail).leftJoin('bookings as b', 'b.customer_id', 'u.id').groupBy('u.id');
  }

  /**
   * Each customer with their build counts and latest booking; `builds_of_viewer` says whether any
   * of their builds is assigned to the person asking (a builder sees those customers' addresses).
   */
  private summaries(trx: Executor, viewerUserId: string, search?: string, searchEmail = true) {
    return this.base(trx, search, searchEmail).select([
      'u.id',
      'u.name',
      sql<string>`u.email::text`.as('email'),
      'u.phone',
      'u.created_at',
      sql<string>`count(b.id)::text`.as('build_count'),
      sql<string>`count(b.id) filter (where b.state in (${sql.join(ACTIVE)}))::text`.as('active_build_count'),
      sql<Date | null>`max(b.created_at)`.as('last_booking_at'),
      sql<boolean>`coalesce(bool_or(b.builder_id in (select id from builders where user_id = ${viewerUserId})), false)`.as(
        'builds_of_viewer',
      ),
    ]);
  }

  /**
   * The customers who match the search, on `users` alone (no bookings joined). `searchEmail` false:
   * a builder's search matches names only, as they do not see every address. LIKE wildcards are
   * escaped, so a search for "50%" means the text, not a pattern.
   */
  private matching(trx: Executor, search?: string, searchEmail = true) {
    let q = trx.selectFrom('users as u').where('u.role', '=', 'customer');
    if (search?.trim()) {
      const pattern = `%${search.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      q = q.where((eb) =>
        searchEmail ? eb.or([eb('u.name', 'ilike', pattern), eb(sql`u.email::text`, 'ilike', pattern)]) : eb('u.name', 'ilike', pattern),
      );
    }
    return q;
  }

  /**
   * One page in two steps: the page's customer ids first (on `users` alone for name, e-mail and
   * join-date sorts; for build count and latest booking against one count per customer read from
   * `bookings_customer_created_idx`), then the summaries of just those customers. Grouping every
   * customer with every booking before the limit made the first page read all bookings.
   */
  async page(
    trx: Executor,
    viewerUserId: string,
    opts: { page: number; pageSize: number; sort: CustomerSort; order: 'asc' | 'desc'; search?: string; searchEmail?: boolean },
  ) {
    const offset = (opts.page - 1) * opts.pageSize;
    const direction = (ob: OrderByItemBuilder) => (opts.order === 'desc' ? ob.desc() : ob.asc()).nullsLast();
    // Sorting by build count or latest booking joins the bookings counted per customer; the others sort on `users` alone.
    const perCustomer = trx
      .selectFrom('bookings')
      .select(['customer_id', sql<number>`count(*)`.as('build_count'), sql<Date>`max(created_at)`.as('last_booking_at')])
      .groupBy('customer_id')
      .as('agg');
    const matching = this.matching(trx, opts.search, opts.searchEmail).$if(
      opts.sort === 'buildCount' || opts.sort === 'lastBookingAt',
      (q) => q.leftJoin(perCustomer, 'agg.customer_id', 'u.id'),
    );
    const key = {
      buildCount: sql`coalesce(agg.build_count, 0)`,
      lastBookingAt: sql`agg.last_booking_at`,
      name: sql`u.name`,
      email: sql`u.email::text`,
      createdAt: sql`u.created_at`,
    }[opts.sort];
    const page = await matching.select('u.id').orderBy(key, direction).orderBy('u.id').limit(opts.pageSize).offset(offset).execute();
    const ids = page.map((r) => r.id);
    const counted = await this.matching(trx, opts.search, opts.searchEmail)
      .select(sql<string>`count(*)::text`.as('total'))
      .executeTakeFirstOrThrow();
    const total = Number(counted.total);
    if (ids.length === 0) return { rows: [], total };
    const found = await this.summaries(trx, viewerUserId).where('u.id', 'in', ids).execute();
    const byId = new Map(found.map((r) => [r.id, r]));
    const rows = ids.map((id) => byId.get(id)).filter((r): r is (typeof found)[number] => r !== undefined);
    return { rows: rows.map((r) => ({ ...r, total: String(total) })), total };
  }

  summary(trx: Executor, viewerUserId: string, id: string) {
    return this.summaries(trx, viewerUserId).where('u.id', '=', id).executeTakeFirst();
  }

  builds(trx: Executor, customerId: string) {
    return trx
      .selectFrom('bookings')
      .select(['id', 'reference', 'state', 'bench_date', 'created_at'])
      .where('customer_id', '=', customerId)
      .orderBy('created_at', 'desc')
      .execute();
  }

  payments(trx: Executor, customerId: string) {
    return trx
      .selectFrom('payments as p')
      .innerJoin('bookings as b', 'b.id', 'p.booking_id')
      .select(['p.id', 'p.booking_id', 'b.reference', 'p.kind', 'p.amount', 'p.currency', 'p.status', 'p.paid_at', 'p.created_at'])
      .where('b.customer_id', '=', customerId)
      .orderBy('p.created_at', 'desc')
      .execute();
  }

  messages(trx: Executor, customerId: string, email: string) {
    return trx
      .selectFrom('mail_outbox as m')
      .select(['m.id', 'm.template', 'm.subject', 'm.to_address', 'm.state', 'm.booking_id', 'm.created_at', 'm.sent_at'])
      .where((eb) =>
        eb.or([
          eb('m.user_id', '=', customerId),
          eb(sql`lower(m.to_address)`, '=', email.toLowerCase()),
          eb('m.booking_id', 'in', eb.selectFrom('bookings').select('id').where('customer_id', '=', customerId)),
        ]),
      )
      .orderBy('m.created_at', 'desc')
      .limit(200)
      .execute();
  }
}

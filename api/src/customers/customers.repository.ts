import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database, Executor } from '../database/database';
import type { CustomerSort } from '@loomwright/shared';

/** States in which a build is still with the shop or on its way there. */
const ACTIVE = ['requested', 'deposit_paid', 'scheduled', 'pedals_received', 'on_bench', 'testing', 'ready'];

const sortColumn: Record<CustomerSort, string> = {
  name: 'name',
  email: 'email',
  createdAt: 'created_at',
  buildCount: 'build_count',
  lastBookingAt: 'last_booking_at',
};

@Injectable()
export class CustomersRepository {
  constructor(private readonly db: Database) {}

  /** `searchEmail` false: a builder's search matches names only, as they do not see every address. */
  private base(trx: Executor, search?: string, searchEmail = true) {
    let q = trx
      .selectFrom('users as u')
      .leftJoin('bookings as b', 'b.customer_id', 'u.id')
      .where('u.role', '=', 'customer')
      .groupBy('u.id');
    if (search?.trim()) {
      // Escape LIKE wildcards so a search for "50%" means the text, not a pattern.
      const pattern = `%${search.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      q = q.where((eb) => (searchEmail ? eb.or([eb('u.name', 'ilike', pattern), eb(sql`u.email::text`, 'ilike', pattern)]) : eb('u.name', 'ilike', pattern)));
    }
    return q;
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
      sql<boolean>`coalesce(bool_or(b.builder_id in (select id from builders where user_id = ${viewerUserId})), false)`.as('builds_of_viewer'),
    ]);
  }

  async page(
    trx: Executor,
    viewerUserId: string,
    opts: { page: number; pageSize: number; sort: CustomerSort; order: 'asc' | 'desc'; search?: string; searchEmail?: boolean },
  ) {
    const rows = await this.summaries(trx, viewerUserId, opts.search, opts.searchEmail)
      .select(sql<string>`count(*) over ()::text`.as('total'))
      .orderBy(sql.ref(sortColumn[opts.sort]), (ob) => (opts.order === 'desc' ? ob.desc() : ob.asc()).nullsLast())
      .orderBy('u.id')
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize)
      .execute();
    let total = rows[0] ? Number(rows[0].total) : 0;
    if (!rows[0] && opts.page > 1) {
      const count = await this.base(trx, opts.search, opts.searchEmail).select('u.id').execute();
      total = count.length;
    }
    return { rows, total };
  }

  summary(trx: Executor, viewerUserId: string, id: string) {
    return this.summaries(trx, viewerUserId)
      .where('u.id', '=', id)
      .executeTakeFirst();
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

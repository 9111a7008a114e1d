import { sql, type Kysely } from 'kysely';
import { demoPriceBook, estimateRig, type RigConfiguration } from '@loomwright/shared';
import type { DB } from '../database';

/**
 * A year of an invented, very busy shop for measuring the backoffice at scale (`npm run bench`):
 * customers, builders, bookings in every state with their quotes, payments, history lines, bench
 * slices for the builds still ahead, and mail. Every row is made by set-based SQL
 * (generate_series), so 100,000 bookings take well under two minutes.
 *
 * Not for a shop's real database: it adds on top of the demo seed (the owner and the price book
 * must exist) and its people have addresses under bench.example.
 */
export interface YearOfDataScale {
  bookings: number;
  customers: number;
  builders: number;
  mails: number;
  /** Bookings (newest first) whose quote carries the engine's whole answer, as a real request does. */
  fullEstimates: number;
}

export const fullYearScale: YearOfDataScale = { bookings: 100_000, customers: 5_000, builders: 20, mails: 200_000, fullEstimates: 10_000 };

const firstNames = [
  'Ada',
  'Bram',
  'Cleo',
  'Dario',
  'Edda',
  'Fenn',
  'Greer',
  'Hollis',
  'Ilse',
  'Joss',
  'Kit',
  'Lark',
  'Mads',
  'Nell',
  'Orrin',
  'Pia',
  'Quill',
  'Rhea',
  'Sten',
  'Tova',
  'Ulla',
  'Vane',
  'Wynn',
  'Xeno',
  'Yara',
  'Zeb',
];
const lastNames = [
  'Ashgrove',
  'Brackwater',
  'Coldharbour',
  'Dunmere',
  'Elderwick',
  'Fallowby',
  'Glenhart',
  'Hazelmoor',
  'Ironside',
  'Juniperhill',
  'Kestrelford',
  'Larchmont',
  'Marrowby',
  'Northcote',
  'Oakhollow',
  'Pennywhistle',
  'Quarrington',
  'Rookwood',
  'Saltmarsh',
  'Thistledown',
  'Underhill',
  'Vellacott',
  'Wexcombe',
  'Yarrowby',
];

/** The 13-pedal board the benchmark prices: buffer, tuner, wah and ten compact pedals in series. */
export function benchBoard(): RigConfiguration {
  const names = ['fuzz', 'overdrive', 'distortion', 'compressor', 'chorus', 'phaser', 'tremolo', 'analog delay', 'digital delay', 'reverb'];
  return {
    surfaceId: 'ridge-100',
    caseId: 'shell-hard',
    routing: { mode: 'serial' },
    pedals: [
      { name: 'Input/output buffer', kind: 'buffer', powered: true, inLoop: false },
      { name: 'Tuner', kind: 'tuner', powered: true, inLoop: false },
      { name: 'Wah', kind: 'treadle', powered: true, inLoop: false },
      ...names.map((name) => ({ name, kind: 'compact' as const, powered: true, inLoop: false })),
    ],
    functions: [],
    level: 'journeyman',
  };
}

/** `onStep` hears how long each step took (the benchmark prints it, to show where the seed spends its time). */
export async function seedYearOfData(
  db: Kysely<DB>,
  scale: YearOfDataScale,
  onStep?: (step: string, seconds: number) => void,
): Promise<Record<string, number>> {
  const version = await db
    .selectFrom('price_book_versions')
    .select((eb) => eb.fn.max('version').as('v'))
    .executeTakeFirst();
  if (!version?.v) throw new Error('Publish a price book first (the demo seed does).');
  const owner = await db.selectFrom('users').select('password_hash').where('role', '=', 'owner').executeTakeFirst();
  const configuration = benchBoard();
  // Older quotes keep their figures but not the checks, so the database stays a few hundred MB.
  const full = estimateRig(configuration, demoPriceBook, { version: 1 });
  const { checks: _checks, ...compact } = full;
  const params = {
    firstNames: sql.val(firstNames),
    lastNames: sql.val(lastNames),
    config: sql.val(JSON.stringify(configuration)),
    fullEstimate: sql.val(JSON.stringify(full)),
    compactEstimate: sql.val(JSON.stringify(compact)),
  };

  await db.transaction().execute(async (trx) => {
    let step = 0;
    const run = async (q: ReturnType<typeof sql>) => {
      const t0 = performance.now();
      await q.execute(trx);
      const text = q.compile(trx).sql;
      onStep?.(
        `${++step}: ${/(insert into \w+|update \w+|create temporary table \w+|set local \w+|drop index \S+|CREATE INDEX \w+)/.exec(text)?.[1] ?? text.slice(0, 40)}`,
        (performance.now() - t0) / 1000,
      );
    };
    await run(sql`set local synchronous_commit = off`);
    // Bulk loading as PostgreSQL's manual advises ("Populating a Database", section 14.4): the
    // secondary indexes of the tables filled here are dropped and built again once the rows are in
    // (a sort per index instead of 100,000 single inserts into each, GIN trigram indexes most of all),
    // with more memory for those builds. Indexes behind a key or constraint stay, and so do the rules
    // they enforce. Estimates are compressed with lz4 where the server has it (faster than the
    // default pglz for the large JSON of each quote); a seed run as superuser also skips the
    // foreign-key checks of rows that all come from this transaction.
    await run(sql`set local maintenance_work_mem = '256MB'`);
    const lz4 = await sql<{
      ok: boolean;
    }>`select 'lz4' = any(enumvals) as ok from pg_settings where name = 'default_toast_compression'`.execute(trx);
    if (lz4.rows[0]?.ok) await run(sql`set local default_toast_compression = 'lz4'`);
    const superuser = await sql<{ ok: boolean }>`select rolsuper as ok from pg_roles where rolname = current_user`.execute(trx);
    if (superuser.rows[0]?.ok) await run(sql`set local session_replication_role = replica`);
    const secondary = await sql<{ name: string; definition: string }>`
      select i.indexrelid::regclass::text as name, pg_get_indexdef(i.indexrelid) as definition
      from pg_index i
      where i.indrelid in ('bookings'::regclass, 'quotes'::regclass, 'payments'::regclass, 'booking_events'::regclass, 'mail_outbox'::regclass)
        and not i.indisunique and not i.indisprimary
        and not exists (select 1 from pg_constraint c where c.conindid = i.indexrelid)`.execute(trx);
    for (const index of secondary.rows) await run(sql`drop index ${sql.id(index.name)}`);

    await run(sql`
      insert into users (email, name, role, created_at)
      select 'player' || g || '@bench.example',
             (${params.firstNames}::text[])[1 + g % 26] || ' ' || (${params.lastNames}::text[])[1 + (g / 26) % 24] || ' ' || g,
             'customer', now() - interval '400 days' + (g * interval '1 minute')
      from generate_series(1, ${scale.customers}::int) g`);

    await run(sql`
      with people as (
        insert into users (email, name, role, password_hash)
        select 'bench-builder' || g || '@bench.example',
               (${params.firstNames}::text[])[1 + (g * 7) % 26] || ' ' || (${params.lastNames}::text[])[1 + (g * 5) % 24],
               'builder', ${owner?.password_hash ?? null}
        from generate_series(1, ${scale.builders}::int) g
        returning id, email)
      insert into builders (user_id, level, hourly_rate, weekly_hours)
      select id,
             (array['apprentice', 'journeyman', 'master'])[1 + n % 3],
             (array[45, 90, 125])[1 + n % 3],
             '{"1": 8, "2": 8, "3": 8, "4": 8, "5": 8}'::jsonb
      from (select id, substring(email from 'bench-builder([0-9]+)@')::int as n from people) p`);

    // Bookings over the last year, newest last; the most recent are still in the queue or on the bench.
    await run(sql`create temporary table bench_customers on commit drop as
      select row_number() over (order by id) as n, id from users where email like 'player%@bench.example'`);
    await run(sql`create temporary table bench_builders on commit drop as
      select row_number() over (order by b.id) - 1 as n, b.id, b.hourly_rate from builders b
      join users u on u.id = b.user_id where u.email like 'bench-builder%@bench.example'`);
    await run(sql`
      create temporary table bench_bookings on commit drop as
      select g as n,
             gen_random_uuid() as id,
             'LW-Y' || lpad(g::text, 6, '0') as reference,
             c.id as customer_id,
             now() - interval '365 days' + ((g::float8 / ${scale.bookings}::int) * interval '365 days') as created_at,
             case
               when g > ${scale.bookings}::int - 300 then 'requested'
               when g > ${scale.bookings}::int - 500 then 'deposit_paid'
               when g > ${scale.bookings}::int - 1500 then 'scheduled'
               when g > ${scale.bookings}::int - 1700 then 'pedals_received'
               when g > ${scale.bookings}::int - 1800 then 'on_bench'
               when g % 40 = 0 then 'declined'
               when g % 53 = 0 then 'cancelled'
               else 'delivered'
             end as state
      from generate_series(1, ${scale.bookings}::int) g
      join bench_customers c on c.n = 1 + (g::bigint * 7919) % ${scale.customers}::int`);
    await run(sql`
      insert into bookings (id, reference, customer_id, state, configuration, builder_id, deposit_status, created_at, updated_at)
      select b.id, b.reference, b.customer_id, b.state, ${params.config}::jsonb,
             case when b.state in ('scheduled', 'pedals_received', 'on_bench', 'delivered')
                  then (select id from bench_builders w where w.n = b.n % ${scale.builders}::int) end,
             -- The word the payments trigger would write for the deposit inserted below (which a
             -- superuser's seed skips with the other triggers); year-of-data.spec.ts checks they agree.
             case when b.state = 'declined' then 'unpaid' when b.state = 'requested' then 'pending'
                  when b.state = 'cancelled' then 'refunded' else 'paid' end,
             b.created_at, b.created_at + interval '2 days'
      from bench_bookings b`);

    await run(sql`
      insert into quotes (booking_id, kind, price_book_version, currency, configuration, estimate, labor_hours, total_low,
                          total_high, deposit, expires_at, created_at)
      select b.id, 'estimate', ${version.v}, 'USD', ${params.config}::jsonb,
             case when b.n > ${scale.bookings}::int - ${scale.fullEstimates}::int then ${params.fullEstimate}::jsonb else ${params.compactEstimate}::jsonb end,
             ${full.laborHours}, ${full.totalLow}, ${full.totalHigh}, ${full.deposit}, b.created_at + interval '30 days', b.created_at
      from bench_bookings b`);
    await run(sql`
      insert into quotes (booking_id, kind, price_book_version, currency, configuration, estimate, labor_hours, total_low,
                          total_high, deposit, hourly_rate, labor_total, total, builder_id, expires_at, created_at)
      select b.id, 'firm', ${version.v}, 'USD', ${params.config}::jsonb, ${params.compactEstimate}::jsonb,
             ${full.laborHours}, ${full.totalLow}, ${full.totalHigh}, ${full.deposit}, w.hourly_rate,
             w.hourly_rate * ${full.laborHours}::numeric, w.hourly_rate * ${full.laborHours}::numeric + ${full.materialsTotal}::numeric,
             w.id, b.created_at + interval '30 days', b.created_at + interval '1 day'
      from bench_bookings b join bench_builders w on w.n = b.n % ${scale.builders}::int
      where b.state in ('scheduled', 'pedals_received', 'on_bench', 'delivered')`);

    await run(sql`
      insert into payments (booking_id, kind, amount, amount_minor, currency, status, checkout_session_id, paid_at, created_at)
      select b.id, 'deposit', ${full.deposit}, (${full.deposit}::numeric * 100)::bigint, 'USD',
             case when b.state = 'requested' then 'pending' when b.state = 'cancelled' then 'refunded' else 'paid' end,
             'cs_bench_' || b.n, case when b.state <> 'requested' then b.created_at + interval '1 hour' end, b.created_at
      from bench_bookings b where b.state <> 'declined'`);
    await run(sql`
      insert into payments (booking_id, kind, amount, amount_minor, currency, status, checkout_session_id, paid_at, created_at)
      select b.id, 'balance', 1000, 100000, 'USD', 'paid', 'cs_bench_balance_' || b.n, b.created_at + interval '20 days',
             b.created_at + interval '20 days'
      from bench_bookings b where b.state = 'delivered'`);

    await run(sql`
      insert into booking_events (booking_id, from_state, to_state, actor_label, note, created_at)
      select b.id, null, 'requested', 'customer', '', b.created_at from bench_bookings b
      union all
      select b.id, 'requested', 'deposit_paid', 'payment', '', b.created_at + interval '1 hour' from bench_bookings b
        where b.state not in ('requested', 'declined')
      union all
      select b.id, 'deposit_paid', b.state, 'bench builder', '', b.created_at + interval '2 days' from bench_bookings b
        where b.state not in ('requested', 'deposit_paid', 'declined')`);

    // Builds still ahead hold bench time: their hours over two days (8 h, then the rest), from the next weekday on, one after another per builder.
    await run(sql`
      with days as (
        select d::date as day, row_number() over (order by d) - 1 as k
        from generate_series(current_date + 1, current_date + 1200, interval '1 day') d
        where extract(isodow from d) < 6),
      ahead as (
        select b.id, b.n % ${scale.builders}::int as builder_n,
               row_number() over (partition by b.n % ${scale.builders}::int order by b.n) - 1 as slot
        from bench_bookings b where b.state in ('scheduled', 'pedals_received', 'on_bench'))
      insert into bench_allocations (booking_id, builder_id, day, hours, day_capacity)
      select a.id, w.id, d.day,
             case when d.k = a.slot * 2 then numrange(0, least(8, ${full.laborHours}::numeric))
                  else numrange(0, ${full.laborHours}::numeric - 8) end,
             8
      from ahead a join bench_builders w on w.n = a.builder_n
      join days d on d.k = a.slot * 2 or (d.k = a.slot * 2 + 1 and ${full.laborHours}::numeric > 8)`);
    await run(sql`
      update bookings set bench_date = first.day, expected_completion = first.day + 1
      from (select booking_id, min(day) as day from bench_allocations group by booking_id) first
      where first.booking_id = bookings.id`);

    await run(sql`
      insert into mail_outbox (message_id, template, to_address, data, subject, booking_id, user_id, state, attempts,
                               created_at, sent_at)
      select '<bench-' || g || '@loomwright.app>',
             (array['booking-requested', 'deposit-received', 'booking-scheduled', 'status-changed'])[1 + g % 4],
             u.email::text, '{}'::jsonb,
             'Your build ' || b.reference, b.id, b.customer_id, 'sent', 1,
             b.created_at + (g % 4) * interval '1 hour', b.created_at + (g % 4) * interval '1 hour' + interval '2 seconds'
      from generate_series(1, ${scale.mails}::int) g
      join bench_bookings b on b.n = 1 + (g - 1) % ${scale.bookings}::int
      join users u on u.id = b.customer_id`);

    for (const index of secondary.rows) await run(sql.raw(index.definition));
    // A superuser's seed skipped the triggers that tell each API process the bench changed
    // (migration 20261203_0700): say it once, delivered when this transaction commits.
    await run(sql`select pg_notify('bench_changed', '')`);
  });
  await sql`select setval('booking_reference_seq', greatest((select last_value from booking_reference_seq), 1000000))`.execute(db);
  const analyzed = performance.now();
  await sql`analyze`.execute(db);
  onStep?.('analyze', (performance.now() - analyzed) / 1000);
  // A shop's tables are vacuumed in the background as they grow; a bulk load is measured before
  // autovacuum has come round. VACUUM sets the visibility map, without which no count or page can be
  // read from an index alone (PostgreSQL manual, "Index-Only Scans and Covering Indexes", 11.9).
  const vacuumed = performance.now();
  await sql`vacuum bookings, payments, users, mail_outbox, bench_allocations`.execute(db);
  onStep?.('vacuum', (performance.now() - vacuumed) / 1000);

  const count = async (
    table: 'users' | 'bookings' | 'quotes' | 'payments' | 'bench_allocations' | 'mail_outbox' | 'booking_events' | 'builders',
  ) =>
    Number(
      (
        await db
          .selectFrom(table)
          .select((eb) => eb.fn.countAll<string>().as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );
  return {
    users: await count('users'),
    builders: await count('builders'),
    bookings: await count('bookings'),
    quotes: await count('quotes'),
    payments: await count('payments'),
    bench_allocations: await count('bench_allocations'),
    booking_events: await count('booking_events'),
    mail_outbox: await count('mail_outbox'),
  };
}

import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { TABLE_OWNERS, tableOwnershipMarkdown } from '../src/database/table-owners';
import { scanSource, scanTree, violations } from './support/table-access';

const SRC = join(__dirname, '..', 'src');
const modules = new Set(
  readdirSync(SRC, { withFileTypes: true })
    .filter((e) => e.isDirectory())
    .map((e) => e.name),
);

// The map is this project's own rule (one repository per aggregate), so the checks below hold the
// code to it; the table names come from the migrations, read by PostgreSQL itself in migrations.spec.ts.
describe('who owns each table (api/src/database/table-owners.ts)', () => {
  it('names real modules as owners and readers, and never lists an owner as its own reader', () => {
    for (const [table, t] of Object.entries(TABLE_OWNERS)) {
      expect(modules, `${table}'s owner`).toContain(t.owner);
      for (const reader of t.readers) {
        expect(modules, `${table}'s reader ${reader}`).toContain(reader);
        expect(reader, `${table} lists its owner among its readers`).not.toBe(t.owner);
      }
    }
  });

  it('holds in api/src: only owners write, only listed readers read, and only repositories query', () => {
    const found = violations(scanTree(SRC));
    expect(found, `\n${found.join('\n')}\n`).toEqual([]);
  });

  it('lists no reader that no longer reads the table (so the map shrinks as the code does)', () => {
    const seen = new Set(scanTree(SRC).accesses.map((a) => `${a.module} ${a.table}`));
    const stale = Object.entries(TABLE_OWNERS).flatMap(([table, t]) =>
      t.readers.filter((r) => !seen.has(`${r} ${table}`)).map((r) => `${r} reads ${table}`),
    );
    expect(stale).toEqual([]);
  });

  // WRITE_TABLE_OWNERS=1 writes the generated table between the markers first (like a snapshot update).
  it('is the table DEVELOPERS.md shows, word for word', () => {
    const path = join(__dirname, '..', '..', 'DEVELOPERS.md');
    const start = '<!-- table-owners:start -->\n';
    const end = '<!-- table-owners:end -->';
    let developers = readFileSync(path, 'utf8');
    const [before, rest] = developers.split(start);
    expect(rest, 'DEVELOPERS.md has the table-owners markers').toBeDefined();
    const shown = rest.slice(0, rest.indexOf(end));
    if (process.env.WRITE_TABLE_OWNERS === '1') {
      developers = `${before}${start}${tableOwnershipMarkdown()}\n${rest.slice(rest.indexOf(end))}`;
      writeFileSync(path, developers);
      return;
    }
    expect(shown).toBe(`${tableOwnershipMarkdown()}\n`);
  });

  // The scanner itself: each kind of breach in a made-up file is caught, so a clean run above means something.
  it('catches a foreign write, an unlisted read, raw SQL and a query in a service', () => {
    const repository = `
      export class PaymentsRepository {
        mark(trx) { return trx.updateTable('bookings as b').set({ state: 'x' }).execute(); }
        events(trx) { return trx.selectFrom('booking_events').selectAll().execute(); }
        raw(trx) { return sql\`insert into quotes (id) values (\${1})\`.execute(trx); }
        own(trx) { return trx.selectFrom('payments').innerJoin('users as u', 'u.id', 'payments.customer_id').selectAll().execute(); }
      }`;
    const found = violations(scanSource('payments/payments.repository.ts', repository));
    expect(found).toEqual([
      expect.stringMatching(/^payments\/payments\.repository\.ts:3 writes bookings .*owner, bookings/),
      expect.stringMatching(/^payments\/payments\.repository\.ts:4 reads booking_events .*payments may not/),
      expect.stringMatching(/^payments\/payments\.repository\.ts:5 writes quotes \(sql\)/),
    ]);

    // A subquery inside a Kysely expression is a read of its own, whichever way the expression
    // builder is reached (its parameter, destructured, nested in exists or a JSON helper), and so is
    // each table of a raw SQL from-list joined by commas.
    const subqueries = `
      export class PaymentsRepository {
        a(trx) { return trx.selectFrom('payments').where('booking_id', 'in', (eb) => eb.selectFrom('booking_events').select('booking_id')).execute(); }
        b(trx) { return trx.selectFrom('payments').where(({ exists, selectFrom }) => exists(selectFrom('quotes').select('id'))).execute(); }
        c(trx) { return trx.selectFrom('payments').select((eb) => jsonArrayFrom(eb.selectFrom('reminders').select('id')).as('r')).execute(); }
        d(trx) { return sql\`select 1 from payments p, sessions s where s.id = p.id\`.execute(trx); }
      }`;
    expect(violations(scanSource('payments/payments.repository.ts', subqueries))).toEqual([
      expect.stringMatching(/^payments\/payments\.repository\.ts:3 reads booking_events \(selectFrom\); payments may not/),
      expect.stringMatching(/^payments\/payments\.repository\.ts:4 reads quotes \(selectFrom\); payments may not/),
      expect.stringMatching(/^payments\/payments\.repository\.ts:5 reads reminders \(selectFrom\); payments may not/),
      expect.stringMatching(/^payments\/payments\.repository\.ts:6 reads sessions \(sql\); payments may not/),
    ]);

    const service = `
      export class TodayService {
        rows() { return this.db.selectFrom('bookings').selectAll().execute(); }
        lock() { return sql\`select pg_advisory_xact_lock(1)\`.execute(this.db); }
        words() { return sql\`b.state = 'ready'\`; }
      }`;
    const inService = violations(scanSource('today/today.service.ts', service));
    expect(inService).toEqual([
      expect.stringMatching(/today\.service\.ts:3 reads bookings .*today may not/),
      'today/today.service.ts:3 queries the database (selectFrom) outside a repository',
      'today/today.service.ts:4 queries the database (sql) outside a repository',
    ]);
  });
});

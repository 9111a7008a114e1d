import { describe, expect, it } from 'vitest';
import { tablesWrittenBy } from './create-database';

// The statement forms of PostgreSQL's manual (SQL Commands: INSERT, UPDATE, DELETE, TRUNCATE), as
// Kysely compiles them (quoted names) and as written by hand.
describe('tablesWrittenBy: the tables a statement writes, so this process drops its copies of them at once', () => {
  it.each([
    ['insert into "bench_allocations" ("booking_id", "day") values ($1, $2) returning "id"', ['bench_allocations']],
    ['update "builders" set "active" = $1 where "id" = $2 returning "id"', ['builders']],
    ['delete from "shop_closures" where "id" = $1 returning "id"', ['shop_closures']],
    ['DELETE FROM ONLY builder_absences WHERE id = $1', ['builder_absences']],
    [
      'truncate "bench_allocations", "layout_approvals", "shop_closures" restart identity cascade',
      ['bench_allocations', 'layout_approvals', 'shop_closures'],
    ],
    ['TRUNCATE TABLE ONLY shop_settings', ['shop_settings']],
    [
      'with people as (insert into users (email) values ($1) returning id) insert into builders (user_id) select id from people',
      ['users', 'builders'],
    ],
    ['insert into "quotes" ("id") values ($1) on conflict ("id") do update set "total" = excluded."total"', ['quotes', 'set']],
  ])('%s', (text, tables) => {
    expect(tablesWrittenBy(text)).toEqual(tables);
  });

  it.each([
    'select "id" from "bench_allocations" where "day" >= $1',
    'select * from "builders" inner join lateral (select 1) as "users" on true where "builders"."id" = $1 for no key update of "builders"',
    'begin',
    'commit',
  ])('reads nothing written in %s', (text) => {
    // FOR NO KEY UPDATE OF names a table it locks, not one it writes: the name after "update" is "of".
    expect(tablesWrittenBy(text).filter((t) => t !== 'of')).toEqual([]);
  });
});

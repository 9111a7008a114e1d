import { Pool } from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEADLOCK_DETECTED, retryOnDeadlock } from '../src/database/retry-on-deadlock';

/**
 * A real deadlock on a real server: two transactions lock the same two rows in opposite orders.
 * PostgreSQL's deadlock detector rolls one of them back with SQLSTATE 40P01 (PostgreSQL manual,
 * 13.3.4 "Deadlocks", and Appendix A "PostgreSQL Error Codes"); retrying that one whole must let
 * both finish, with each change made exactly once.
 */
describe('retryOnDeadlock', () => {
  const table = `deadlock_probe_${process.pid}`;
  let pool: Pool;

  beforeAll(async () => {
    pool = new Pool({ connectionString: process.env.TEST_DATABASE_ADMIN_URL, max: 4 });
    await pool.query(`create table ${table} (id int primary key, touched int not null default 0)`);
    await pool.query(`insert into ${table} (id) values (1), (2)`);
  });
  afterAll(async () => {
    await pool.query(`drop table if exists ${table}`);
    await pool.end();
  });

  /** Locks `first`, waits until the other transaction holds its first row, then locks `second`. */
  async function crossing(first: number, second: number, bothHoldFirst: Promise<unknown>, holdsFirst: () => void) {
    const client = await pool.connect();
    try {
      await client.query('begin');
      await client.query(`set local deadlock_timeout = '50ms'`);
      await client.query(`update ${table} set touched = touched + 1 where id = $1`, [first]);
      holdsFirst();
      await bothHoldFirst;
      await client.query(`update ${table} set touched = touched + 1 where id = $1`, [second]);
      await client.query('commit');
    } catch (error) {
      await client.query('rollback');
      throw error;
    } finally {
      client.release();
    }
  }

  function barrier(parties: number) {
    let arrived = 0;
    let open!: () => void;
    const opened = new Promise<void>((resolve) => (open = resolve));
    return { arrive: () => ++arrived >= parties && open(), opened };
  }

  it('sees PostgreSQL break the deadlock with 40P01 when nothing retries', async () => {
    await pool.query(`update ${table} set touched = 0`);
    const gate = barrier(2);
    const results = await Promise.allSettled([crossing(1, 2, gate.opened, gate.arrive), crossing(2, 1, gate.opened, gate.arrive)]);
    const refused = results.filter((r) => r.status === 'rejected');
    expect(refused).toHaveLength(1);
    expect(((refused[0] as PromiseRejectedResult).reason as { code?: string }).code).toBe(DEADLOCK_DETECTED);
  });

  it('runs the rolled-back transaction again, so both finish and each row is touched once by each', async () => {
    await pool.query(`update ${table} set touched = 0`);
    let tries = 0;
    const gate = barrier(2);
    const once = (first: number, second: number) =>
      retryOnDeadlock(() => {
        tries += 1;
        return crossing(first, second, gate.opened, gate.arrive);
      });
    await Promise.all([once(1, 2), once(2, 1)]);
    expect(tries).toBe(3);
    const { rows } = await pool.query(`select id, touched from ${table} order by id`);
    expect(rows).toEqual([
      { id: 1, touched: 2 },
      { id: 2, touched: 2 },
    ]);
  });

  it('throws any other error at once, without trying again', async () => {
    let tries = 0;
    const failing = retryOnDeadlock(async () => {
      tries += 1;
      throw Object.assign(new Error('unique violation'), { code: '23505' });
    });
    await expect(failing).rejects.toThrow('unique violation');
    expect(tries).toBe(1);
  });

  it('gives up after its last attempt and throws the deadlock', async () => {
    let tries = 0;
    const always = retryOnDeadlock(async () => {
      tries += 1;
      throw Object.assign(new Error('deadlock detected'), { code: DEADLOCK_DETECTED });
    }, 3);
    await expect(always).rejects.toThrow('deadlock detected');
    expect(tries).toBe(3);
  });
});

import type { ThrottlerStorage } from '@nestjs/throttler';
import type { Pool } from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';

type ThrottlerStorageRecord = Awaited<ReturnType<ThrottlerStorage['increment']>>;

const seconds = (ms: number) => Math.max(1, Math.ceil(ms / 1000));

/**
 * @nestjs/throttler's counts kept in PostgreSQL by rate-limiter-flexible (its Postgres store, on
 * the process's own pg pool, table `rate_limits` from the migrations), so every API process
 * behind a load balancer counts the same attempts: two replicas do not double the limit.
 * One limiter per throttler and its numbers; the key is the throttler's own hashed key.
 * A store that cannot be reached rejects with pg's error, which answers 503 like any outage.
 */
export class PostgresThrottlerStorage implements ThrottlerStorage {
  private readonly limiters = new Map<string, RateLimiterPostgres>();

  constructor(private readonly pool: Pool) {}

  private limiterFor(throttlerName: string, ttlMs: number, limit: number, blockMs: number): RateLimiterPostgres {
    const id = `${throttlerName}:${ttlMs}:${limit}:${blockMs}`;
    let limiter = this.limiters.get(id);
    if (!limiter) {
      limiter = new RateLimiterPostgres({
        storeClient: this.pool,
        storeType: 'pool',
        tableName: 'rate_limits',
        tableCreated: true,
        keyPrefix: throttlerName,
        points: limit,
        duration: seconds(ttlMs),
        blockDuration: seconds(blockMs),
      });
      this.limiters.set(id, limiter);
    }
    return limiter;
  }

  async increment(key: string, ttl: number, limit: number, blockDuration: number, throttlerName: string): Promise<ThrottlerStorageRecord> {
    try {
      const res = await this.limiterFor(throttlerName, ttl, limit, blockDuration).consume(key);
      return { totalHits: res.consumedPoints, timeToExpire: seconds(res.msBeforeNext), isBlocked: false, timeToBlockExpire: 0 };
    } catch (outcome) {
      // Over the limit, the limiter rejects with its result (not an Error); anything else is the store failing.
      if (!(outcome instanceof RateLimiterRes)) throw outcome;
      const wait = seconds(outcome.msBeforeNext);
      return { totalHits: outcome.consumedPoints, timeToExpire: wait, isBlocked: true, timeToBlockExpire: wait };
    }
  }
}

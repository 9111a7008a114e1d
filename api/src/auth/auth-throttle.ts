import { authMessages } from '@loomwright/shared';
import { ConfigService } from '@nestjs/config';
import type { ThrottlerAsyncOptions } from '@nestjs/throttler';
import { Pool } from 'pg';
import type { AppConfig } from '../config/configuration';
import { PostgresThrottlerStorage } from './postgres-throttler-storage';

/** The account a password attempt is for: the e-mail typed, or the signed-in person's (changing a password). */
const emailOf = (req: { body?: { email?: unknown }; user?: { email?: unknown } }): string =>
  typeof req.body?.email === 'string'
    ? req.body.email.trim().toLowerCase()
    : typeof req.user?.email === 'string'
      ? req.user.email.toLowerCase()
      : '';

/**
 * Limits for the routes that take a password or send a link (sign-in, sign-up, reset, accepting
 * an invitation, changing a password). Two buckets: one per client address and e-mail, so guessing one account's
 * password stalls quickly; and a looser one per client address, so trying many accounts from one
 * place stalls too. The guard is applied per route with @UseGuards(ThrottlerGuard), not globally.
 * The counts live in PostgreSQL (PostgresThrottlerStorage), shared by every API process. Behind a
 * load balancer, set TRUST_PROXY so req.ip is the client's address, not the balancer's.
 */
export const authThrottlerOptions: ThrottlerAsyncOptions = {
  inject: [ConfigService, Pool],
  useFactory: (config: ConfigService<AppConfig, true>, pool: Pool) => {
    const { throttleLimit, throttleSeconds } = config.get('auth', { infer: true });
    return {
      errorMessage: authMessages.throttled,
      storage: new PostgresThrottlerStorage(pool),
      throttlers: [
        {
          name: 'address-and-email',
          ttl: throttleSeconds * 1000,
          limit: throttleLimit,
          getTracker: (req) => `${req.ip}|${emailOf(req)}`,
        },
        { name: 'address', ttl: throttleSeconds * 1000, limit: throttleLimit * 3, getTracker: (req) => String(req.ip) },
      ],
    };
  },
};

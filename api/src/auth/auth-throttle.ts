import { authMessages } from '@loomwright/shared';
import { ConfigService } from '@nestjs/config';
import type { ThrottlerAsyncOptions } from '@nestjs/throttler';
import type { AppConfig } from '../config/configuration';

const emailOf = (req: Record<string, any>): string =>
  typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';

/**
 * Limits for the routes that take a password or send a link (sign-in, sign-up, reset, accepting
 * an invitation). Two buckets: one per client address and e-mail, so guessing one account's
 * password stalls quickly; and a looser one per client address, so trying many accounts from one
 * place stalls too. The guard is applied per route with @UseGuards(ThrottlerGuard), not globally.
 * Behind a load balancer, set Express's "trust proxy" so req.ip is the client's address.
 */
export const authThrottlerOptions: ThrottlerAsyncOptions = {
  inject: [ConfigService],
  useFactory: (config: ConfigService<AppConfig, true>) => {
    const { throttleLimit, throttleSeconds } = config.get('auth', { infer: true });
    return {
      errorMessage: authMessages.throttled,
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

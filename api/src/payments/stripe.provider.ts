import type { Provider } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import Stripe from 'stripe';
import type { AppConfig } from '../config/configuration';

/**
 * The payment SDK, pointed by configuration at the provider or at the local fake. Injected by its
 * own class, so services ask for `Stripe`. Switching to the real provider is configuration only.
 */
export const stripeProvider: Provider = {
  provide: Stripe,
  inject: [ConfigService],
  useFactory: (config: ConfigService<AppConfig, true>) => {
    const { secretKey, host, port, protocol } = config.get('payments', { infer: true });
    return new Stripe(secretKey, {
      // Unset (production): the SDK's own address of the provider.
      ...(host === undefined ? {} : { host }),
      ...(port === undefined ? {} : { port }),
      ...(protocol === undefined ? {} : { protocol }),
      maxNetworkRetries: 2,
      timeout: 15_000,
      appInfo: { name: 'Loomwright' },
    });
  },
};

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
    const payments = config.get('payments', { infer: true });
    return new Stripe(payments.secretKey, {
      host: payments.host,
      port: payments.port,
      protocol: payments.protocol,
      maxNetworkRetries: 2,
      timeout: 15_000,
      appInfo: { name: 'Loomwright' },
    });
  },
};

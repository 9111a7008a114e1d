import type { EstimateResult, RigConfiguration } from '@loomwright/shared';
import type { Executor } from '../database/database';

/**
 * What bookings need from the estimate engine: price a configuration against the current price
 * book, inside the caller's transaction when one is given. EstimatesService provides it.
 */
export abstract class QuotePricer {
  abstract price(configuration: RigConfiguration, trx?: Executor): Promise<EstimateResult>;
}

import type { EstimateView } from '@loomwright/shared';

/** The catalog, read by the configurator, saved configurations and the deposit policy. */
export const catalogKeys = { all: ['catalog'] as const };

/**
 * An estimate is a pure answer to a configuration, so it is cached under the configuration's
 * encoded form (the same string the URL carries) and the view asked for: the configurator and the
 * request page share one entry for the same board.
 */
export const estimateKeys = {
  all: ['estimates'] as const,
  answer: (encoded: string, view: EstimateView) => [...estimateKeys.all, encoded, view] as const,
};

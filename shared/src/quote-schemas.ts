import { z } from 'zod';
import { rigConfigurationSchema } from './estimate/schema';
import { oneOf, requestObject } from './request-fields';

/** POST /api/quotes/pdf: any configuration, saved or not, priced now into a printable quote. */
export const quotePdfRequestSchema = z
  .object(
    { configuration: rigConfigurationSchema },
    { error: 'The request must be a JSON object holding the configuration, like {"configuration": …}' },
  )
  .strict();

export type QuotePdfRequest = z.infer<typeof quotePdfRequestSchema>;

/**
 * POST /api/estimates?view=…: `full` (the default, the documented shape) or `panel`, what the
 * configurator shows while the player edits: the same figures and checks without the signal chain's
 * device list and the cable schedule's per-cable and per-lead lists (counts and feet stay), which
 * only the Review step and the build sheet print. About half the bytes for a 13-pedal board.
 */
export const estimateViews = ['full', 'panel'] as const;
export type EstimateView = (typeof estimateViews)[number];
export const estimateQuerySchema = requestObject({ view: oneOf('view', estimateViews).default('full') });
export type EstimateQuery = z.infer<typeof estimateQuerySchema>;

import { z } from 'zod';
import { rigConfigurationSchema } from './estimate/schema';

/** POST /api/quotes/pdf: any configuration, saved or not, priced now into a printable quote. */
export const quotePdfRequestSchema = z
  .object({ configuration: rigConfigurationSchema }, { error: 'The body must be a JSON object { "configuration": … }' })
  .strict();

export type QuotePdfRequest = z.infer<typeof quotePdfRequestSchema>;

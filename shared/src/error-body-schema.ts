import { z } from 'zod';
import { errorCodes } from './error-codes';

// Apart from error-codes.ts so that a page which only needs the codes (every page, through the API
// client) does not carry zod in its first load: a module-level z.object() call is kept by the
// bundler even when nothing reads it.

/** Every 4xx/5xx body the API sends. */
export const apiErrorBodySchema = z
  .object({
    statusCode: z.number().int().min(400).max(599).describe('The HTTP status, repeated.'),
    code: z.enum(errorCodes).describe('Stable: branch on this, never on the message.'),
    message: z.string().describe('What went wrong and what to do, written for people.'),
    details: z.array(z.string()).optional().describe('One line per field for validation_failed, in words a person reads.'),
    issues: z
      .array(z.object({ path: z.string().describe('The field, e.g. pedals[3].currentMa ("" for the whole body).'), message: z.string() }))
      .optional()
      .describe('validation_failed: each problem with its field, for a program that shows a message under its field.'),
    requestId: z.string().optional().describe('The id of this request in the server’s logs.'),
  })
  .describe('An error answer');

export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;

import type { NextFunction, Request, Response } from 'express';
import { sendError } from './error-body';

/** No Loomwright body nests deeper than about five levels (a price book's lists of items). */
export const MAX_BODY_DEPTH = 20;

// With the `u` flag a well-formed surrogate pair reads as one astral code point, so only a lone
// half of a pair (U+D800–U+DFFF, general category Cs) matches: text that is not valid Unicode.
const LONE_SURROGATE = /\p{Cs}/u;

export type BodyProblem = 'too-deep' | 'lone-surrogate' | null;

/**
 * Walks a parsed body without recursion (a deep body must not overflow the stack here either):
 * too deep, or any key or text holding a lone surrogate, which UTF-8 cannot encode (RFC 3629 §3)
 * and which would otherwise be stored silently as U+FFFD or throw deep inside a validator.
 * Runs on every request with a body or a query, so it keeps two flat stacks (values and their
 * depths) and reads keys with for…in, instead of a [value, depth] pair and an Object.entries
 * array for every node.
 */
export function findBodyProblem(body: unknown): BodyProblem {
  if (body === null || typeof body !== 'object') return typeof body === 'string' && LONE_SURROGATE.test(body) ? 'lone-surrogate' : null;
  const values: unknown[] = [body];
  const depths: number[] = [0];
  while (values.length > 0) {
    const value = values.pop();
    const depth = depths.pop()!;
    if (typeof value === 'string') {
      if (LONE_SURROGATE.test(value)) return 'lone-surrogate';
    } else if (value !== null && typeof value === 'object') {
      if (depth >= MAX_BODY_DEPTH) return 'too-deep';
      const record = value as Record<string, unknown>;
      for (const key in record) {
        if (!Object.prototype.hasOwnProperty.call(record, key)) continue;
        if (LONE_SURROGATE.test(key)) return 'lone-surrogate';
        values.push(record[key]);
        depths.push(depth + 1);
      }
    }
  }
  return null;
}

const words: Record<Exclude<BodyProblem, null>, string> = {
  'too-deep': `The request body is nested more than ${MAX_BODY_DEPTH} levels deep; no request here needs that many. Send a flatter body.`,
  'lone-surrogate':
    'The request contains text that is not valid Unicode (half of a surrogate pair, such as \\ud800); correct the text and send it again.',
};

/** Refuses a parsed body or query string that is too deep or holds invalid Unicode, with a 400 in words. */
export function refuseHostileInput(req: Request, res: Response, next: NextFunction): void {
  const problem = findBodyProblem(req.body) ?? findBodyProblem(req.query);
  if (problem) {
    sendError(req, res, 400, problem === 'too-deep' ? 'body_too_deep' : 'invalid_unicode', words[problem]);
    return;
  }
  next();
}

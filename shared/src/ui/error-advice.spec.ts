import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { apiErrorFrom } from '../api-client';
import { describeIssues, issuePath } from '../estimate/schema';
import { errorAdvice, fieldsCoverError, formFieldName, setServerFieldErrors } from './error-advice';

// The body the API's ZodValidationPipe writes for a refused body (api/src/common/zod-validation.pipe.ts),
// built here from a real zod failure so the paths are zod's own.
function validationAnswer(schema: z.ZodType, input: unknown) {
  const result = schema.safeParse(input);
  if (result.success) throw new Error('expected a refusal');
  const lines = describeIssues(result.error);
  return apiErrorFrom(400, {
    statusCode: 400,
    code: 'validation_failed',
    message: lines,
    issues: result.error.issues.map((issue, i) => ({ path: issuePath(issue.path), message: lines[i] })),
  });
}

const shipment = z.object({ carrier: z.string().min(1, 'Enter the carrier'), tracking: z.string().min(4, 'Enter the tracking number') });
const outputs = z.object({ outputs: z.array(z.object({ volts: z.number().max(18, 'Volts must be at most 18') })) });

describe('validation_failed answers onto react-hook-form fields', () => {
  it('the client keeps each issue’s path and words', () => {
    const error = validationAnswer(shipment, { carrier: '', tracking: '12' });
    expect(error.code).toBe('validation_failed');
    expect(error.issues.map((i) => i.path)).toEqual(['carrier', 'tracking']);
  });

  // react-hook-form names a list item's field with dots ("outputs.1.volts"), per its `Path` type.
  it('writes a list path the way react-hook-form names the field', () => {
    const error = validationAnswer(outputs, { outputs: [{ volts: 9 }, { volts: 24 }] });
    expect(error.issues[0].path).toBe('outputs[1].volts');
    expect(formFieldName(error.issues[0].path)).toBe('outputs.1.volts');
  });

  it('sets each issue on its field, focusing the first, and says when every issue found one', () => {
    const error = validationAnswer(shipment, { carrier: '', tracking: '12' });
    const calls: Array<[string, { type: string; message?: string }, { shouldFocus?: boolean } | undefined]> = [];
    setServerFieldErrors(error, (name, e, o) => calls.push([name, e, o]), ['carrier', 'tracking']);
    expect(calls).toEqual([
      ['carrier', { type: 'server', message: 'Enter the carrier' }, { shouldFocus: true }],
      ['tracking', { type: 'server', message: 'Enter the tracking number' }, { shouldFocus: false }],
    ]);
    expect(fieldsCoverError(error, ['carrier', 'tracking'])).toBe(true);
    expect(fieldsCoverError(error, ['carrier'])).toBe(false);
  });

  it('a listed list or group takes each problem under it on the problem’s own field', () => {
    const error = validationAnswer(outputs, { outputs: [{ volts: 9 }, { volts: 24 }] });
    const calls: string[] = [];
    setServerFieldErrors(error, (name) => calls.push(name), ['outputs']);
    expect(calls).toEqual(['outputs.1.volts']);
    expect(fieldsCoverError(error, ['outputs'])).toBe(true);
  });

  it('reads the paths of a body that holds the form’s values under a key (`from`), and nothing outside it', () => {
    const publish = z.object({ book: outputs, notes: z.string().max(3, 'Keep the notes short') });
    const error = validationAnswer(publish, { book: { outputs: [{ volts: 24 }] }, notes: 'far too long' });
    expect(error.issues.map((i) => i.path)).toEqual(['book.outputs[0].volts', 'notes']);
    const calls: Array<[string, string | undefined]> = [];
    setServerFieldErrors(error, (name, e) => calls.push([name, e.message]), ['outputs'], { from: 'book' });
    expect(calls).toEqual([['outputs.0.volts', error.issues[0].message]]);
    expect(error.issues[0].message).toContain('Volts must be at most 18');
    expect(fieldsCoverError(error, ['outputs'], { from: 'book' })).toBe(false);
  });

  it('sets nothing for another code', () => {
    const error = apiErrorFrom(409, {
      statusCode: 409,
      code: 'conflict',
      message: 'Not now.',
      issues: [{ path: 'carrier', message: 'x' }],
    });
    const calls: unknown[] = [];
    setServerFieldErrors(error, (...args) => calls.push(args), ['carrier']);
    expect(calls).toEqual([]);
    expect(fieldsCoverError(error, ['carrier'])).toBe(false);
  });
});

describe('advice by code', () => {
  it('offers another date for every refusal of a bench date, and nothing special for a plain conflict', () => {
    const answer = (status: number, code: string) => apiErrorFrom(status, { statusCode: status, code, message: 'Refused in words.' });
    for (const [status, code] of [
      [409, 'bench_time_taken'],
      [409, 'bench_day_full'],
      [409, 'bench_day_closed'],
      [400, 'bench_date_in_past'],
      [400, 'too_soon_to_ship'],
    ] as const)
      expect(errorAdvice(answer(status, code)), code).toBe('pick-another-date');
    expect(errorAdvice(answer(409, 'conflict'))).toBe('other');
    expect(errorAdvice(answer(409, 'too_late_to_cancel'))).toBe('other');
  });
});

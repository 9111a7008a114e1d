import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, apiErrorFrom, createApiClient } from '../api-client';
import { ERROR_CODE_STATUS, errorCodes, type ErrorCode } from '../error-codes';
import { authKeys } from './get-me';
import { canSucceedOnRetry, createQueryClient, retryRead, retryReadDelay } from './query-client';

const answer = (code: ErrorCode, retryAfter?: string) =>
  apiErrorFrom(ERROR_CODE_STATUS[code], { statusCode: ERROR_CODE_STATUS[code], code, message: 'words for people' }, retryAfter);
const noAnswer = () => new ApiError(0, 'The shop could not be reached; check your connection and try again.');

describe('which failed reads are asked again: by code, not by status', () => {
  it('no answer at all (a network failure) is worth another try', () => {
    expect(canSucceedOnRetry(noAnswer())).toBe(true);
  });

  // RFC 9110 §15.6.4: 503 "the server is currently unable to handle the request due to a temporary
  // overload or scheduled maintenance, which will likely be alleviated after some delay".
  it('the shop’s database away (503 shop_unavailable) is worth another try', () => {
    expect(canSucceedOnRetry(answer('shop_unavailable', '5'))).toBe(true);
  });

  // RFC 9110 §15.6.3: 502 is an upstream that did not answer properly; the next call may reach it.
  it('the payment provider not answering (502 payment_provider_error) is worth another try', () => {
    expect(canSucceedOnRetry(answer('payment_provider_error'))).toBe(true);
  });

  // RFC 6585 §4: 429 "MAY include a Retry-After header indicating how long to wait before making a new request".
  it('a rate limit is tried again after its Retry-After when that is short, and not when it is long or unsaid', () => {
    expect(canSucceedOnRetry(answer('too_many_attempts', '3'))).toBe(true);
    expect(retryReadDelay(1, answer('too_many_attempts', '3'))).toBe(3000);
    expect(canSucceedOnRetry(answer('too_many_attempts', '900'))).toBe(false);
    expect(canSucceedOnRetry(answer('too_many_attempts'))).toBe(false);
  });

  // RFC 9110 §15.5: a 4xx says the client erred; the same request gets the same answer. Every code
  // of the shared list with a 4xx status but the rate limit is left alone, and so are the 5xx codes
  // that are not passing trouble: the server's own failure and a price book nobody has published.
  it('every other code of the shared list answers the same on retry, so is not asked again', () => {
    const retried = errorCodes.filter((code) => canSucceedOnRetry(answer(code, '1')));
    expect(retried.sort()).toEqual(['payment_provider_error', 'shop_unavailable', 'too_many_attempts']);
    for (const code of [
      'validation_failed',
      'not_found',
      'session_ended',
      'bench_day_full',
      'internal_error',
      'price_book_missing',
    ] as const)
      expect(retryRead(0, answer(code)), code).toBe(false);
  });

  it('a retryable failure is tried twice more at most', () => {
    expect([0, 1, 2].map((count) => retryRead(count, noAnswer()))).toEqual([true, true, false]);
  });

  it('anything that is not an answer of the API (a bug in a fetcher) is not asked again', () => {
    expect(canSucceedOnRetry(new TypeError('x is undefined'))).toBe(false);
  });

  // RFC 9110 §10.2.3: Retry-After is a delay in whole seconds or an HTTP date; only the seconds are read.
  it('the client reads Retry-After’s delay-seconds, and leaves a date unread', () => {
    expect(answer('shop_unavailable', '120').retryAfterSeconds).toBe(120);
    expect(answer('shop_unavailable', 'Fri, 31 Dec 1999 23:59:59 GMT').retryAfterSeconds).toBeUndefined();
  });
});

describe('the apps’ QueryClient with these rules, over the real API client', () => {
  afterEach(() => vi.useRealTimers());

  const json = (status: number, body: unknown, headers: Record<string, string> = {}) =>
    new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json', ...headers } });

  async function readWith(...answers: Response[]) {
    const fetchImpl = vi.fn<typeof fetch>();
    for (const response of answers) fetchImpl.mockResolvedValueOnce(response);
    const api = createApiClient('/api', fetchImpl);
    const client = createQueryClient();
    vi.useFakeTimers();
    const read = client.fetchQuery({ queryKey: authKeys.me(), queryFn: () => api.get('/a-read') }).then(
      (data) => ({ data }),
      (error: unknown) => ({ error }),
    );
    await vi.advanceTimersByTimeAsync(60_000);
    return { outcome: await read, calls: fetchImpl.mock.calls.length };
  }

  it('a 429 with Retry-After: 2 is asked again after its wait and then succeeds', async () => {
    const { outcome, calls } = await readWith(
      json(429, { statusCode: 429, code: 'too_many_attempts', message: 'Too many attempts.' }, { 'Retry-After': '2' }),
      json(200, { ok: true }),
    );
    expect(outcome).toEqual({ data: { ok: true } });
    expect(calls).toBe(2);
  });

  it('a 404 not_found is asked once and its error shows', async () => {
    const { outcome, calls } = await readWith(json(404, { statusCode: 404, code: 'not_found', message: 'No such build.' }));
    expect((outcome as { error: ApiError }).error.code).toBe('not_found');
    expect(calls).toBe(1);
  });

  it('a 503 shop_unavailable three times in a row is asked three times, then its error shows', async () => {
    const away = () =>
      json(503, { statusCode: 503, code: 'shop_unavailable', message: 'The shop is not answering.' }, { 'Retry-After': '5' });
    const { outcome, calls } = await readWith(away(), away(), away(), json(200, { ok: true }));
    expect((outcome as { error: ApiError }).error.code).toBe('shop_unavailable');
    expect(calls).toBe(3);
  });
});

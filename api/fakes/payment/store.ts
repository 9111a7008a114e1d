import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import type Stripe from 'stripe';

export const fakeId = (prefix: string) => `${prefix}_test_${randomBytes(12).toString('hex')}`;

/**
 * The fake's sense of time. Tests move it forward (`advance`) to reach a session's `expires_at`
 * without waiting a day; everything the fake stamps or compares reads `now()`.
 */
export class FakeClock {
  offsetSeconds = 0;
  now(): number {
    return Math.floor(Date.now() / 1000) + this.offsetSeconds;
  }
  advance(seconds: number): void {
    this.offsetSeconds += seconds;
  }
}

/** What happens after the money is asked for: the provider's own behaviours, chosen by test number or per call. */
export type SettleOutcome = 'succeed' | 'fail';
export type RefundBehaviour = 'succeed' | 'pending' | 'fail' | 'fail_later';

/** What the fake keeps beside a session that is not part of the wire object. */
export interface SessionExtra {
  lineItems: Array<{ name: string; description: string | null; unitAmount: number; quantity: number }>;
  intentMetadata: Stripe.Metadata;
  lastError: string | null;
}

/** What the fake keeps beside an intent: how a processing payment ends, and what its refunds and dispute do. */
export interface IntentPlan {
  settle?: { outcome: SettleOutcome; code?: string; message?: string };
  refund?: RefundBehaviour;
  dispute?: { reason: string };
}

const storedMaps = ['sessions', 'sessionExtras', 'intents', 'intentPlans', 'charges', 'refunds', 'disputes', 'idempotent'] as const;
type StoredMap = (typeof storedMaps)[number];

/**
 * The fake's memory, like a provider's test-mode account. Every wire object is typed with the
 * SDK's own generated types, so a field the provider always sends cannot be forgotten. Given a
 * file, the store is kept there after every change and read back at start, so restarting
 * `npm start` forgets no open checkout, paid deposit or refund; without one (the tests) it lives
 * as long as the process.
 */
export class FakeStore {
  readonly sessions = new Map<string, Stripe.Checkout.Session>();
  readonly sessionExtras = new Map<string, SessionExtra>();
  readonly intents = new Map<string, Stripe.PaymentIntent>();
  readonly intentPlans = new Map<string, IntentPlan>();
  readonly charges = new Map<string, Stripe.Charge>();
  readonly refunds = new Map<string, Stripe.Refund>();
  readonly disputes = new Map<string, Stripe.Dispute>();
  /** Idempotency-Key → the first request's fingerprint and answer, replayed on a repeat. */
  readonly idempotent = new Map<string, { fingerprint: string; status: number; body: unknown }>();

  constructor(private readonly file?: string) {
    if (!file || !existsSync(file)) return;
    const saved = JSON.parse(readFileSync(file, 'utf8')) as Partial<Record<StoredMap, [string, never][]>>;
    for (const name of storedMaps) for (const [id, value] of saved[name] ?? []) this[name].set(id, value);
  }

  /** Writes the whole store to its file (a temporary file renamed over it, so a crash leaves the old copy). */
  save(): void {
    if (!this.file) return;
    const state = Object.fromEntries(storedMaps.map((name) => [name, [...this[name].entries()]]));
    mkdirSync(dirname(this.file), { recursive: true });
    writeFileSync(`${this.file}.tmp`, JSON.stringify(state));
    renameSync(`${this.file}.tmp`, this.file);
  }

  extra(sessionId: string): SessionExtra {
    return this.sessionExtras.get(sessionId) ?? { lineItems: [], intentMetadata: {}, lastError: null };
  }

  chargeOf(intent: Stripe.PaymentIntent): Stripe.Charge | undefined {
    return typeof intent.latest_charge === 'string' ? this.charges.get(intent.latest_charge) : undefined;
  }
}

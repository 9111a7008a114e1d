import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

export const fakeId = (prefix: string) => `${prefix}_test_${randomBytes(12).toString('hex')}`;
export const nowSeconds = () => Math.floor(Date.now() / 1000);

export type Metadata = Record<string, string>;

export interface FakeSession {
  id: string;
  object: 'checkout.session';
  mode: string;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  amount_subtotal: number;
  currency: string;
  metadata: Metadata;
  client_reference_id: string | null;
  customer_email: string | null;
  success_url: string;
  cancel_url: string | null;
  url: string | null;
  payment_intent: string | null;
  created: number;
  expires_at: number;
  livemode: false;
  /** Not part of the wire object: what the page shows and what the intent is given. */
  lineItems: Array<{ name: string; description: string | null; unitAmount: number; quantity: number }>;
  intentMetadata: Metadata;
  lastError: string | null;
}

export interface FakeIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'requires_payment_method' | 'succeeded';
  metadata: Metadata;
  latest_charge: string | null;
  last_payment_error: { code: string; decline_code?: string; message: string; type: 'card_error' } | null;
  created: number;
  livemode: false;
}

export interface FakeCharge {
  id: string;
  object: 'charge';
  amount: number;
  amount_refunded: number;
  currency: string;
  payment_intent: string;
  paid: boolean;
  refunded: boolean;
  status: 'succeeded';
  metadata: Metadata;
  created: number;
  livemode: false;
}

export interface FakeRefund {
  id: string;
  object: 'refund';
  amount: number;
  currency: string;
  charge: string;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
  metadata: Metadata;
  created: number;
}

const storedMaps = ['sessions', 'intents', 'charges', 'refunds', 'idempotent'] as const;
type StoredMap = (typeof storedMaps)[number];

/**
 * The fake's memory, like a provider's test-mode account. Given a file, it is kept there after
 * every change and read back at start, so restarting `npm start` forgets no open checkout, paid
 * deposit or refund; without one (the tests) it lives as long as the process.
 */
export class FakeStore {
  readonly sessions = new Map<string, FakeSession>();
  readonly intents = new Map<string, FakeIntent>();
  readonly charges = new Map<string, FakeCharge>();
  readonly refunds = new Map<string, FakeRefund>();
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

  /** The wire form of a session: what GET /v1/checkout/sessions/:id answers. */
  sessionView(s: FakeSession) {
    const { lineItems: _l, intentMetadata: _m, lastError: _e, ...wire } = s;
    return wire;
  }
}

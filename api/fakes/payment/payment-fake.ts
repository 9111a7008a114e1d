import { checkAmountForCurrency } from './currency-rules';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import qs from 'qs';
import type Stripe from 'stripe';
import { checkoutPage } from './checkout-page';
import { newCharge, newDispute, newEvent, newIntent, newRefund, newSession, type EventOf } from './objects';
import {
  checkCurrency,
  checkExpiresAt,
  checkMetadata,
  checkMethods,
  checkNames,
  lineItemParams,
  paymentIntentDataParams,
  positiveInt,
  priceDataParams,
  productDataParams,
  refundParams,
  refundReasons,
  RequestError,
  sessionParams,
  url,
} from './params';
import { fakeId, FakeClock, FakeStore, type IntentPlan, type RefundBehaviour, type SettleOutcome } from './store';
import { outcomeForBankAccount, outcomeForCard, type PayOutcome } from './test-cards';
import { WebhookSender } from './webhook-sender';

export interface PaymentFakeOptions {
  port: number;
  host?: string;
  /** Where signed events are posted (the API's /api/payments/webhook); none: events are only kept. */
  webhookUrl?: string;
  webhookSecret: string;
  /** A file to keep the fake's state in across restarts (npm start); none: memory only. */
  stateFile?: string;
  /** Waits between delivery attempts of one event; the provider retries for days, we for a minute. */
  retryDelaysMs?: number[];
  /**
   * How long a bank debit takes to settle (or fail) on its own. null: only when told
   * (`control.settle`), which the tests use so they can look at the "processing" state first.
   */
  settleDelayMs?: number | null;
  /** How soon a dispute opens, or a "fail later" refund fails, after its trigger. */
  laterDelayMs?: number;
  /** How often open sessions are checked against their `expires_at`. */
  expirySweepMs?: number;
}

/** What a test (or the /_control routes) can tell the fake to do, as the provider would on its own. */
export interface PaymentFakeControl {
  clock: FakeClock;
  /** Moves the fake's clock on; sessions whose time has come expire at once, with their event. */
  advance(seconds: number): void;
  /** Ends a processing bank debit now: as its test account planned, or as told. */
  settle(intentId: string, outcome?: SettleOutcome): void;
  /** The next payment on any session behaves so (per call, instead of per test number). */
  nextPayment(plan: IntentPlan): void;
  /** The next refund created behaves so. */
  nextRefund(behaviour: RefundBehaviour): void;
  /** A pending refund ends now. */
  finishRefund(refundId: string, outcome: 'succeeded' | 'failed'): void;
  /** The cardholder's bank opens a dispute on the intent's charge. */
  openDispute(intentId: string, reason?: string): Stripe.Dispute;
  /** The bank decides the dispute. */
  closeDispute(disputeId: string, outcome: 'won' | 'lost'): Stripe.Dispute;
  /** A refund made in the provider's dashboard, outside the product (whole charge unless `amount`). */
  dashboardRefund(intentId: string, amount?: number): Stripe.Refund;
}

export interface PaymentFake {
  url: string;
  port: number;
  store: FakeStore;
  events: Stripe.Event[];
  webhooks: WebhookSender;
  control: PaymentFakeControl;
  /** Posts an already sent event again (same id, fresh signature), as the provider does on a retry. */
  resend(eventId: string): void;
  close(): Promise<void>;
}

function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (c: Buffer) => {
      size += c.length;
      if (size > 1_000_000) reject(new RequestError(413, 'Request body too large.'));
      else chunks.push(c);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

const sendJson = (res: ServerResponse, status: number, body: unknown) => {
  res.writeHead(status, { 'content-type': 'application/json', 'request-id': fakeId('req') });
  res.end(JSON.stringify(body));
};
const sendHtml = (res: ServerResponse, status: number, html: string) => {
  res.writeHead(status, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' });
  res.end(html);
};

const listOf = (v: unknown): unknown[] => (Array.isArray(v) ? v : v && typeof v === 'object' ? Object.values(v) : []);

export async function startPaymentFake(options: PaymentFakeOptions): Promise<PaymentFake> {
  const store = new FakeStore(options.stateFile);
  const clock = new FakeClock();
  const events: Stripe.Event[] = [];
  const webhooks = new WebhookSender(
    options.webhookUrl,
    options.webhookSecret,
    options.retryDelaysMs ?? [500, 1_000, 2_000, 4_000, 8_000, 16_000, 30_000],
  );
  const settleDelayMs = options.settleDelayMs === undefined ? 20_000 : options.settleDelayMs;
  const laterDelayMs = options.laterDelayMs ?? 1_000;
  const timers = new Set<NodeJS.Timeout>();
  const later = (ms: number, fn: () => void) => {
    const t = setTimeout(() => {
      timers.delete(t);
      try {
        fn();
      } finally {
        store.save();
      }
    }, ms);
    t.unref();
    timers.add(t);
  };
  let nextPaymentPlan: IntentPlan | null = null;
  let nextRefundBehaviour: RefundBehaviour | null = null;
  let baseUrl = '';

  function emit<T extends Stripe.Event['type']>(type: T, object: EventOf<T>['data']['object']) {
    const event = newEvent(type, object, clock.now());
    events.push(event);
    webhooks.send(event);
  }

  function createSession(raw: unknown): Stripe.Checkout.Session {
    const params = checkNames(raw, sessionParams);
    if (params.mode !== 'payment') throw new RequestError(400, 'This test service supports mode=payment only.', 'mode');
    const successUrl = url(params.success_url, 'success_url', true)!;
    const cancelUrl = url(params.cancel_url, 'cancel_url', false);
    const items = listOf(params.line_items);
    if (items.length === 0) throw new RequestError(400, 'Missing required param: line_items.', 'line_items');
    let currency = '';
    const lineItems = items.map((rawItem, i) => {
      const item = checkNames(rawItem, lineItemParams, `line_items[${i}]`);
      const price = checkNames(item.price_data, priceDataParams, `line_items[${i}][price_data]`);
      if (!item.price_data)
        throw new RequestError(400, `Missing required param: line_items[${i}][price_data].`, `line_items[${i}][price_data]`);
      const c = checkCurrency(price.currency, `line_items[${i}][price_data][currency]`);
      if (currency && c !== currency) throw new RequestError(400, 'All line items must use the same currency.', 'line_items');
      currency = c;
      const product = checkNames(price.product_data, productDataParams, `line_items[${i}][price_data][product_data]`);
      if (typeof product.name !== 'string' || !product.name.trim()) {
        throw new RequestError(
          400,
          `Missing required param: line_items[${i}][price_data][product_data][name].`,
          `line_items[${i}][price_data][product_data][name]`,
        );
      }
      return {
        name: product.name,
        description: typeof product.description === 'string' ? product.description : null,
        unitAmount: checkAmountForCurrency(
          positiveInt(price.unit_amount, `line_items[${i}][price_data][unit_amount]`),
          c,
          `line_items[${i}][price_data][unit_amount]`,
        ),
        quantity: positiveInt(item.quantity ?? 1, `line_items[${i}][quantity]`),
      };
    });
    const intentData = checkNames(params.payment_intent_data, paymentIntentDataParams, 'payment_intent_data');
    const metadata = checkMetadata(params.metadata, 'metadata');
    const intentMetadata = checkMetadata(intentData.metadata, 'payment_intent_data[metadata]');
    const methods = checkMethods(params.payment_method_types, currency);
    const now = clock.now();
    const expiresAt = checkExpiresAt(params.expires_at, now);
    for (const key of ['client_reference_id', 'customer_email'] as const) {
      if (params[key] !== undefined && (typeof params[key] !== 'string' || (params[key] as string).length > 200)) {
        throw new RequestError(400, `Invalid ${key}: must be a string of at most 200 characters.`, key);
      }
    }
    const id = fakeId('cs');
    const session = newSession({
      id,
      created: now,
      expiresAt,
      amount: lineItems.reduce((sum, l) => sum + l.unitAmount * l.quantity, 0),
      currency,
      metadata,
      clientReferenceId: (params.client_reference_id as string | undefined) ?? null,
      customerEmail: (params.customer_email as string | undefined) ?? null,
      successUrl,
      cancelUrl,
      url: `${baseUrl}/pay/${id}`,
      paymentMethodTypes: methods,
    });
    store.sessions.set(id, session);
    store.sessionExtras.set(id, { lineItems, intentMetadata, lastError: null });
    return session;
  }

  function intentFor(session: Stripe.Checkout.Session): Stripe.PaymentIntent {
    const existing = typeof session.payment_intent === 'string' ? store.intents.get(session.payment_intent) : undefined;
    if (existing) return existing;
    const intent = newIntent({
      created: clock.now(),
      amount: session.amount_total ?? 0,
      currency: session.currency ?? 'usd',
      metadata: { ...store.extra(session.id).intentMetadata },
      paymentMethodTypes: session.payment_method_types,
      receiptEmail: session.customer_email,
    });
    store.intents.set(intent.id, intent);
    session.payment_intent = intent.id;
    return intent;
  }

  function sessionOfIntent(intentId: string) {
    return [...store.sessions.values()].find((s) => s.payment_intent === intentId);
  }

  function expire(session: Stripe.Checkout.Session) {
    Object.assign(session, { status: 'expired', url: null });
    emit('checkout.session.expired', session);
  }

  function pay(session: Stripe.Checkout.Session, outcome: PayOutcome, method: string): { ok: true } | { ok: false; message: string } {
    const intent = intentFor(session);
    const extra = store.extra(session.id);
    if (outcome.kind === 'declined') {
      intent.last_payment_error = {
        type: 'card_error',
        code: outcome.code,
        decline_code: outcome.declineCode,
        message: outcome.message,
      } as Stripe.PaymentIntent.LastPaymentError;
      extra.lastError = outcome.message;
      store.sessionExtras.set(session.id, extra);
      emit('payment_intent.payment_failed', intent);
      return { ok: false, message: outcome.message };
    }
    // A per-call instruction wins over the test number's own behaviour.
    const plan: IntentPlan = { ...(outcome.plan ?? {}), ...(nextPaymentPlan ?? {}) };
    nextPaymentPlan = null;
    store.intentPlans.set(intent.id, plan);
    const delayed = outcome.kind === 'delayed' || plan.settle !== undefined;
    const charge = newCharge(intent, { created: clock.now(), method, status: delayed ? 'pending' : 'succeeded' });
    store.charges.set(charge.id, charge);
    Object.assign(intent, { latest_charge: charge.id, last_payment_error: null, payment_method: charge.payment_method });
    extra.lastError = null;
    store.sessionExtras.set(session.id, extra);
    if (delayed) {
      Object.assign(intent, { status: 'processing' });
      Object.assign(session, { status: 'complete', payment_status: 'unpaid', url: null });
      emit('payment_intent.processing', intent);
      emit('checkout.session.completed', session);
      if (settleDelayMs !== null) later(settleDelayMs, () => settle(intent.id));
      return { ok: true };
    }
    Object.assign(intent, { status: 'succeeded', amount_received: intent.amount });
    Object.assign(session, { status: 'complete', payment_status: 'paid', url: null });
    emit('payment_intent.succeeded', intent);
    emit('checkout.session.completed', session);
    if (plan.dispute) later(laterDelayMs, () => openDispute(intent.id, plan.dispute!.reason));
    return { ok: true };
  }

  function settle(intentId: string, told?: SettleOutcome) {
    const intent = store.intents.get(intentId);
    if (!intent) throw new RequestError(404, `No such payment_intent: '${intentId}'`, 'id');
    if (intent.status !== 'processing') return; // settled already (by time or by a test)
    const plan = store.intentPlans.get(intentId) ?? {};
    const outcome = told ?? plan.settle?.outcome ?? 'succeed';
    const charge = store.chargeOf(intent)!;
    const session = sessionOfIntent(intentId);
    if (outcome === 'succeed') {
      Object.assign(charge, { status: 'succeeded', paid: true, captured: true, amount_captured: charge.amount });
      Object.assign(intent, { status: 'succeeded', amount_received: intent.amount });
      emit('payment_intent.succeeded', intent);
      if (session) {
        Object.assign(session, { payment_status: 'paid' });
        emit('checkout.session.async_payment_succeeded', session);
      }
      if (plan.dispute) later(laterDelayMs, () => openDispute(intent.id, plan.dispute!.reason));
      return;
    }
    const code = plan.settle?.code ?? 'payment_method_provider_decline';
    const message = plan.settle?.message ?? 'The bank did not complete the debit.';
    Object.assign(charge, { status: 'failed', failure_code: code, failure_message: message });
    Object.assign(intent, {
      status: 'requires_payment_method',
      last_payment_error: { type: 'invalid_request_error', code, message } as Stripe.PaymentIntent.LastPaymentError,
    });
    emit('payment_intent.payment_failed', intent);
    if (session) emit('checkout.session.async_payment_failed', session);
  }

  function refundChanged(refund: Stripe.Refund, charge: Stripe.Charge) {
    emit('refund.updated', refund);
    if (refund.status === 'failed') {
      charge.amount_refunded = Math.max(0, charge.amount_refunded - refund.amount);
      charge.refunded = false;
      emit('refund.failed', refund);
    }
  }

  function makeRefund(
    intent: Stripe.PaymentIntent,
    amount: number | undefined,
    reason: Stripe.Refund.Reason | null,
    metadata: Stripe.Metadata,
    behaviour?: RefundBehaviour,
  ) {
    const charge = store.chargeOf(intent);
    if (intent.status !== 'succeeded' || !charge || charge.status !== 'succeeded') {
      throw new RequestError(400, `This PaymentIntent (${intent.id}) does not have a successful charge to refund.`, 'payment_intent');
    }
    if (charge.disputed) {
      const dispute = [...store.disputes.values()].find((d) => d.charge === charge.id);
      if (dispute && !['won', 'warning_closed'].includes(dispute.status)) {
        throw new RequestError(
          400,
          `Charge ${charge.id} has been charged back; it cannot be refunded.`,
          'charge',
          'invalid_request_error',
          'charge_disputed',
        );
      }
    }
    const remaining = charge.amount - charge.amount_refunded;
    if (remaining <= 0)
      throw new RequestError(
        400,
        `Charge ${charge.id} has already been refunded.`,
        'charge',
        'invalid_request_error',
        'charge_already_refunded',
      );
    const value = amount ?? remaining;
    if (value > remaining)
      throw new RequestError(400, `Refund amount (${value}) is greater than unrefunded amount on charge (${remaining}).`, 'amount');
    const mode = behaviour ?? nextRefundBehaviour ?? store.intentPlans.get(intent.id)?.refund ?? 'succeed';
    nextRefundBehaviour = null;
    const status = mode === 'pending' ? 'pending' : mode === 'fail' ? 'failed' : 'succeeded';
    const created = newRefund(charge, { created: clock.now(), amount: value, reason, metadata, status });
    if (status === 'failed') created.failure_reason = 'expired_or_canceled_card';
    store.refunds.set(created.id, created);
    if (status !== 'failed') {
      charge.amount_refunded += value;
      charge.refunded = charge.amount_refunded >= charge.amount;
    }
    emit('charge.refunded', charge);
    emit('refund.created', created);
    if (status === 'failed') emit('refund.failed', created);
    if (mode === 'fail_later') {
      later(laterDelayMs, () => {
        created.status = 'failed';
        created.failure_reason = 'expired_or_canceled_card';
        refundChanged(created, charge);
      });
    }
    return created;
  }

  function refund(raw: unknown): Stripe.Refund {
    const params = checkNames(raw, refundParams);
    const intentId = params.payment_intent
      ? String(params.payment_intent)
      : params.charge
        ? (store.charges.get(String(params.charge))?.payment_intent as string | undefined)
        : undefined;
    if (!params.payment_intent && !params.charge)
      throw new RequestError(400, 'One of the following params should be provided for this request: payment_intent or charge.');
    const intent = intentId ? store.intents.get(intentId) : undefined;
    if (!intent)
      throw new RequestError(
        404,
        `No such payment_intent: '${intentId ?? String(params.charge ?? '')}'`,
        'payment_intent',
        'invalid_request_error',
        'resource_missing',
      );
    let reason: Stripe.Refund.Reason | null = null;
    if (params.reason !== undefined) {
      if (!refundReasons.includes(params.reason as (typeof refundReasons)[number])) {
        throw new RequestError(400, `Invalid reason: must be one of ${refundReasons.join(', ')}`, 'reason');
      }
      reason = params.reason as Stripe.Refund.Reason;
    }
    const amount =
      params.amount === undefined ? undefined : checkAmountForCurrency(positiveInt(params.amount, 'amount'), intent.currency, 'amount');
    return makeRefund(intent, amount, reason, checkMetadata(params.metadata, 'metadata'));
  }

  function openDispute(intentId: string, reason = 'fraudulent'): Stripe.Dispute {
    const intent = store.intents.get(intentId);
    const charge = intent ? store.chargeOf(intent) : undefined;
    if (!intent || !charge || charge.status !== 'succeeded')
      throw new RequestError(400, `PaymentIntent ${intentId} has no successful charge to dispute.`);
    if (charge.disputed) throw new RequestError(400, `Charge ${charge.id} is already disputed.`);
    const dispute = newDispute(charge, { created: clock.now(), reason });
    store.disputes.set(dispute.id, dispute);
    charge.disputed = true;
    emit('charge.dispute.created', dispute);
    return dispute;
  }

  function closeDispute(disputeId: string, outcome: 'won' | 'lost'): Stripe.Dispute {
    const dispute = store.disputes.get(disputeId);
    if (!dispute) throw new RequestError(404, `No such dispute: '${disputeId}'`);
    if (['won', 'lost', 'warning_closed'].includes(dispute.status)) throw new RequestError(400, `Dispute ${disputeId} is already closed.`);
    dispute.status = outcome;
    emit('charge.dispute.closed', dispute);
    return dispute;
  }

  function finishRefund(refundId: string, outcome: 'succeeded' | 'failed') {
    const r = store.refunds.get(refundId);
    if (!r) throw new RequestError(404, `No such refund: '${refundId}'`);
    if (r.status !== 'pending' && r.status !== 'requires_action')
      throw new RequestError(400, `Refund ${refundId} is ${r.status}, not pending.`);
    const charge = store.charges.get(String(r.charge))!;
    r.status = outcome;
    if (outcome === 'failed') r.failure_reason = 'lost_or_stolen_card';
    refundChanged(r, charge);
  }

  function sweepExpired() {
    const now = clock.now();
    let changed = false;
    for (const s of store.sessions.values()) {
      if (s.status === 'open' && s.expires_at <= now) {
        expire(s);
        changed = true;
      }
    }
    if (changed) store.save();
  }

  const control: PaymentFakeControl = {
    clock,
    advance(seconds) {
      clock.advance(seconds);
      sweepExpired();
    },
    settle: (id, outcome) => settle(id, outcome),
    nextPayment(plan) {
      nextPaymentPlan = plan;
    },
    nextRefund(behaviour) {
      nextRefundBehaviour = behaviour;
    },
    finishRefund,
    openDispute,
    closeDispute,
    dashboardRefund(intentId, amount) {
      const intent = store.intents.get(intentId);
      if (!intent) throw new RequestError(404, `No such payment_intent: '${intentId}'`);
      return makeRefund(intent, amount, 'requested_by_customer', {});
    },
  };

  async function api(req: IncomingMessage, res: ServerResponse, path: string) {
    const auth = req.headers.authorization ?? '';
    if (!/^Bearer sk_(test|live)_\S+$/.test(auth)) {
      throw new RequestError(401, 'Invalid API Key provided.', undefined, 'invalid_request_error');
    }
    const raw = req.method === 'POST' ? await readBody(req) : '';
    const params = qs.parse(raw, { depth: 10, arrayLimit: 100 }) as Record<string, unknown>;
    const key = req.method === 'POST' ? req.headers['idempotency-key'] : undefined;
    const idemKey = typeof key === 'string' && key ? `${auth}:${key}` : undefined;
    if (idemKey) {
      const seen = store.idempotent.get(idemKey);
      if (seen) {
        if (seen.fingerprint !== `${path}\n${raw}`) {
          throw new RequestError(
            400,
            `Keys for idempotent requests can only be used with the same parameters they were first used with.`,
            undefined,
            'idempotency_error',
          );
        }
        res.setHeader('idempotent-replayed', 'true');
        return sendJson(res, seen.status, seen.body);
      }
    }
    const answer = (status: number, body: unknown) => {
      if (idemKey) store.idempotent.set(idemKey, { fingerprint: `${path}\n${raw}`, status, body });
      sendJson(res, status, body);
    };
    let m: RegExpMatchArray | null;
    if (req.method === 'POST' && path === '/v1/checkout/sessions') return answer(200, createSession(params));
    if (req.method === 'GET' && (m = path.match(/^\/v1\/checkout\/sessions\/([\w-]+)$/))) {
      return answer(200, found(store.sessions.get(m[1]), 'checkout.session', m[1]));
    }
    if (req.method === 'POST' && (m = path.match(/^\/v1\/checkout\/sessions\/([\w-]+)\/expire$/))) {
      checkNames(params, { expand: false });
      const s = found(store.sessions.get(m[1]), 'checkout.session', m[1]);
      if (s.status !== 'open') throw new RequestError(400, `Only Checkout Sessions with a status in [open] can be expired.`);
      expire(s);
      return answer(200, s);
    }
    if (req.method === 'GET' && (m = path.match(/^\/v1\/payment_intents\/([\w-]+)$/))) {
      return answer(200, found(store.intents.get(m[1]), 'payment_intent', m[1]));
    }
    if (req.method === 'POST' && path === '/v1/refunds') return answer(200, refund(params));
    if (req.method === 'GET' && (m = path.match(/^\/v1\/refunds\/([\w-]+)$/))) {
      return answer(200, found(store.refunds.get(m[1]), 'refund', m[1]));
    }
    throw new RequestError(
      404,
      `Unrecognized request URL (${req.method}: ${path}). This test service answers only the calls Loomwright makes.`,
    );
  }

  /** Test-only routes (no provider has them): what a test or a person trying the product tells the fake to do. */
  async function controlRoute(req: IncomingMessage, res: ServerResponse, path: string) {
    if (req.method !== 'POST') throw new RequestError(405, 'Control routes take POST.');
    const body = new URLSearchParams(await readBody(req));
    let m: RegExpMatchArray | null;
    if (path === '/_control/clock/advance') {
      const seconds = Number(body.get('seconds'));
      if (!Number.isInteger(seconds) || seconds <= 0) throw new RequestError(400, 'seconds must be a positive whole number.', 'seconds');
      control.advance(seconds);
      return sendJson(res, 200, { now: clock.now() });
    }
    if (path === '/_control/payment_intents/settle_processing') {
      // Every bank debit still settling ends now, as its test account planned (browser tests use this).
      const processing = [...store.intents.values()].filter((i) => i.status === 'processing');
      for (const intent of processing) control.settle(intent.id);
      return sendJson(res, 200, { settled: processing.map((i) => i.id) });
    }
    if ((m = path.match(/^\/_control\/payment_intents\/([\w-]+)\/settle$/))) {
      const outcome = body.get('outcome');
      if (outcome !== null && outcome !== 'succeed' && outcome !== 'fail')
        throw new RequestError(400, 'outcome must be succeed or fail.', 'outcome');
      control.settle(m[1], outcome ?? undefined);
      return sendJson(res, 200, found(store.intents.get(m[1]), 'payment_intent', m[1]));
    }
    if ((m = path.match(/^\/_control\/payment_intents\/([\w-]+)\/dispute$/)))
      return sendJson(res, 200, control.openDispute(m[1], body.get('reason') ?? undefined));
    if ((m = path.match(/^\/_control\/payment_intents\/([\w-]+)\/refund$/))) {
      const amount = body.get('amount');
      return sendJson(res, 200, control.dashboardRefund(m[1], amount === null ? undefined : positiveInt(amount, 'amount')));
    }
    if ((m = path.match(/^\/_control\/disputes\/([\w-]+)\/close$/))) {
      const outcome = body.get('outcome');
      if (outcome !== 'won' && outcome !== 'lost') throw new RequestError(400, 'outcome must be won or lost.', 'outcome');
      return sendJson(res, 200, control.closeDispute(m[1], outcome));
    }
    if ((m = path.match(/^\/_control\/refunds\/([\w-]+)\/finish$/))) {
      const outcome = body.get('outcome');
      if (outcome !== 'succeeded' && outcome !== 'failed') throw new RequestError(400, 'outcome must be succeeded or failed.', 'outcome');
      control.finishRefund(m[1], outcome);
      return sendJson(res, 200, store.refunds.get(m[1]));
    }
    throw new RequestError(404, `No control route ${path}.`);
  }

  function found<T>(value: T | undefined, kind: string, id: string): T {
    if (!value) throw new RequestError(404, `No such ${kind}: '${id}'`, 'id', 'invalid_request_error', 'resource_missing');
    return value;
  }

  async function page(req: IncomingMessage, res: ServerResponse, id: string) {
    const session = store.sessions.get(id);
    if (!session)
      return sendHtml(
        res,
        404,
        '<!doctype html><title>Not found</title><p>There is no checkout at this address. Go back to the shop and start the payment again.</p>',
      );
    if (session.status === 'open' && session.expires_at <= clock.now()) expire(session);
    const extra = store.extra(id);
    if (req.method === 'GET') return sendHtml(res, 200, checkoutPage(session, extra));
    const form = new URLSearchParams(await readBody(req));
    if (session.status !== 'open') return sendHtml(res, 409, checkoutPage(session, extra));
    const method = form.get('method') ?? 'card';
    if (!session.payment_method_types.includes(method)) {
      return sendHtml(res, 400, checkoutPage(session, extra, { error: 'That way of paying is not offered for this checkout.' }));
    }
    const outcome =
      method === 'card'
        ? outcomeForCard(form.get('card') ?? '')
        : outcomeForBankAccount(form.get('routing') ?? '', form.get('account') ?? '');
    if (method !== 'us_bank_account' && outcome.kind === 'delayed') {
      return sendHtml(res, 400, checkoutPage(session, extra, { error: 'That way of paying is not offered for this checkout.' }));
    }
    const result = pay(session, outcome, method);
    if (!result.ok) {
      return sendHtml(res, 402, checkoutPage(session, store.extra(id), { error: result.message, typed: form.get('card') ?? '', method }));
    }
    res.writeHead(303, { location: (session.success_url ?? '').replace('{CHECKOUT_SESSION_ID}', session.id) });
    res.end();
  }

  const server = createServer((req, res) => {
    const path = new URL(req.url ?? '/', 'http://fake').pathname;
    const handle = async () => {
      if (path.startsWith('/v1/')) return api(req, res, path);
      if (path.startsWith('/_control/')) return controlRoute(req, res, path);
      const m = path.match(/^\/pay\/([\w-]+)$/);
      if (m && (req.method === 'GET' || req.method === 'POST')) return page(req, res, m[1]);
      if (path === '/health') return sendJson(res, 200, { status: 'ok' });
      sendJson(res, 404, { error: { type: 'invalid_request_error', message: `Nothing at ${path}.` } });
    };
    handle()
      .catch((error: unknown) => {
        if (res.headersSent) return res.end();
        if (error instanceof RequestError) {
          return sendJson(res, error.status, {
            error: {
              type: error.type,
              message: error.message,
              ...(error.param ? { param: error.param } : {}),
              ...(error.code ? { code: error.code } : {}),
            },
          });
        }
        sendJson(res, 500, { error: { type: 'api_error', message: error instanceof Error ? error.message : String(error) } });
      })
      // Only a POST changes anything; keep the state file in step with it.
      .finally(() => {
        if (req.method === 'POST') store.save();
      });
  });

  await new Promise<void>((resolve) => server.listen(options.port, options.host ?? '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${options.host ?? '127.0.0.1'}:${port}`;
  // Bank debits still settling when the fake last stopped settle on their time again.
  if (settleDelayMs !== null)
    for (const intent of store.intents.values()) if (intent.status === 'processing') later(settleDelayMs, () => settle(intent.id));
  const sweep = setInterval(sweepExpired, options.expirySweepMs ?? 1_000);
  sweep.unref();
  return {
    url: baseUrl,
    port,
    store,
    events,
    webhooks,
    control,
    resend(eventId) {
      const event = events.find((e) => e.id === eventId);
      if (!event) throw new Error(`no event ${eventId}`);
      webhooks.send(event);
    },
    close: () =>
      new Promise<void>((resolve) => {
        clearInterval(sweep);
        for (const t of timers) clearTimeout(t);
        webhooks.close();
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

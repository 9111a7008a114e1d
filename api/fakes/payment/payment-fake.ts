import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import qs from 'qs';
import { checkoutPage } from './checkout-page';
import { fakeId, FakeStore, nowSeconds, type FakeIntent, type FakeSession, type Metadata } from './store';
import { outcomeForCard } from './test-cards';
import { WebhookSender, type FakeEvent } from './webhook-sender';

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
}

export interface PaymentFake {
  url: string;
  port: number;
  store: FakeStore;
  events: FakeEvent[];
  webhooks: WebhookSender;
  /** Posts an already sent event again (same id, fresh signature), as the provider does on a retry. */
  resend(eventId: string): void;
  close(): Promise<void>;
}

const API_VERSION = '2026-01-28';

class RequestError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
    readonly type = 'invalid_request_error',
  ) {
    super(message);
  }
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

const asRecord = (v: unknown): Record<string, unknown> => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {});
const asMetadata = (v: unknown): Metadata =>
  Object.fromEntries(Object.entries(asRecord(v)).map(([k, val]) => [k, String(val)]));
const listOf = (v: unknown): unknown[] => (Array.isArray(v) ? v : v && typeof v === 'object' ? Object.values(v) : []);

function positiveInt(v: unknown, param: string): number {
  const n = Number(v);
  if (!Number.isInteger(n) || n <= 0) throw new RequestError(400, `Invalid positive integer: ${param}`, param);
  return n;
}

export async function startPaymentFake(options: PaymentFakeOptions): Promise<PaymentFake> {
  const store = new FakeStore(options.stateFile);
  const events: FakeEvent[] = [];
  const webhooks = new WebhookSender(
    options.webhookUrl,
    options.webhookSecret,
    options.retryDelaysMs ?? [500, 1_000, 2_000, 4_000, 8_000, 16_000, 30_000],
  );
  let baseUrl = '';

  const emit = (type: string, object: Record<string, unknown>) => {
    const event: FakeEvent = {
      id: fakeId('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: nowSeconds(),
      type,
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      data: { object: structuredClone(object) },
    };
    events.push(event);
    webhooks.send(event);
  };

  function createSession(params: Record<string, unknown>): FakeSession {
    if (params.mode !== 'payment') throw new RequestError(400, 'This test service supports mode=payment only.', 'mode');
    if (typeof params.success_url !== 'string' || !/^https?:\/\//.test(params.success_url)) {
      throw new RequestError(400, 'Missing required param: success_url.', 'success_url');
    }
    const items = listOf(params.line_items);
    if (items.length === 0) throw new RequestError(400, 'Missing required param: line_items.', 'line_items');
    let currency = '';
    const lineItems = items.map((raw, i) => {
      const item = asRecord(raw);
      const price = asRecord(item.price_data);
      const product = asRecord(price.product_data);
      const c = String(price.currency ?? '').toLowerCase();
      if (!/^[a-z]{3}$/.test(c)) throw new RequestError(400, `Invalid currency: line_items[${i}][price_data][currency]`, `line_items[${i}][price_data][currency]`);
      if (currency && c !== currency) throw new RequestError(400, 'All line items must share one currency.', 'line_items');
      currency = c;
      if (!product.name) throw new RequestError(400, `Missing required param: line_items[${i}][price_data][product_data][name].`);
      return {
        name: String(product.name),
        description: product.description ? String(product.description) : null,
        unitAmount: positiveInt(price.unit_amount, `line_items[${i}][price_data][unit_amount]`),
        quantity: positiveInt(item.quantity ?? 1, `line_items[${i}][quantity]`),
      };
    });
    const total = lineItems.reduce((sum, l) => sum + l.unitAmount * l.quantity, 0);
    const id = fakeId('cs');
    const session: FakeSession = {
      id,
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: total,
      amount_subtotal: total,
      currency,
      metadata: asMetadata(params.metadata),
      client_reference_id: params.client_reference_id ? String(params.client_reference_id) : null,
      customer_email: params.customer_email ? String(params.customer_email) : null,
      success_url: params.success_url,
      cancel_url: typeof params.cancel_url === 'string' ? params.cancel_url : null,
      url: `${baseUrl}/pay/${id}`,
      payment_intent: null,
      created: nowSeconds(),
      expires_at: params.expires_at ? Number(params.expires_at) : nowSeconds() + 24 * 3600,
      livemode: false,
      lineItems,
      intentMetadata: asMetadata(asRecord(params.payment_intent_data).metadata),
      lastError: null,
    };
    store.sessions.set(id, session);
    return session;
  }

  function intentFor(session: FakeSession): FakeIntent {
    const existing = session.payment_intent ? store.intents.get(session.payment_intent) : undefined;
    if (existing) return existing;
    const intent: FakeIntent = {
      id: fakeId('pi'),
      object: 'payment_intent',
      amount: session.amount_total,
      amount_received: 0,
      currency: session.currency,
      status: 'requires_payment_method',
      metadata: { ...session.intentMetadata },
      latest_charge: null,
      last_payment_error: null,
      created: nowSeconds(),
      livemode: false,
    };
    store.intents.set(intent.id, intent);
    session.payment_intent = intent.id;
    return intent;
  }

  function pay(session: FakeSession, card: string): { ok: true } | { ok: false; message: string } {
    const outcome = outcomeForCard(card);
    const intent = intentFor(session);
    if (outcome.kind === 'declined') {
      intent.last_payment_error = { code: outcome.code, decline_code: outcome.declineCode, message: outcome.message, type: 'card_error' };
      session.lastError = outcome.message;
      emit('payment_intent.payment_failed', { ...intent });
      return { ok: false, message: outcome.message };
    }
    const charge = {
      id: fakeId('ch'),
      object: 'charge' as const,
      amount: intent.amount,
      amount_refunded: 0,
      currency: intent.currency,
      payment_intent: intent.id,
      paid: true,
      refunded: false,
      status: 'succeeded' as const,
      metadata: { ...intent.metadata },
      created: nowSeconds(),
      livemode: false as const,
    };
    store.charges.set(charge.id, charge);
    Object.assign(intent, { status: 'succeeded', amount_received: intent.amount, latest_charge: charge.id, last_payment_error: null });
    Object.assign(session, { status: 'complete', payment_status: 'paid', url: null, lastError: null });
    emit('payment_intent.succeeded', { ...intent });
    emit('checkout.session.completed', store.sessionView(session));
    return { ok: true };
  }

  function refund(params: Record<string, unknown>) {
    const intentId = params.payment_intent ? String(params.payment_intent) : params.charge ? store.charges.get(String(params.charge))?.payment_intent : undefined;
    const intent = intentId ? store.intents.get(intentId) : undefined;
    if (!intent) throw new RequestError(404, `No such payment_intent: '${intentId ?? ''}'`, 'payment_intent');
    const charge = intent.latest_charge ? store.charges.get(intent.latest_charge) : undefined;
    if (intent.status !== 'succeeded' || !charge) {
      throw new RequestError(400, `This PaymentIntent (${intent.id}) does not have a successful charge to refund.`, 'payment_intent');
    }
    const remaining = charge.amount - charge.amount_refunded;
    const amount = params.amount === undefined ? remaining : positiveInt(params.amount, 'amount');
    if (remaining <= 0) throw new RequestError(400, `Charge ${charge.id} has already been refunded.`, 'charge', 'invalid_request_error');
    if (amount > remaining) throw new RequestError(400, `Refund amount (${amount}) is greater than unrefunded amount on charge (${remaining}).`, 'amount');
    const created = {
      id: fakeId('re'),
      object: 'refund' as const,
      amount,
      currency: charge.currency,
      charge: charge.id,
      payment_intent: intent.id,
      reason: params.reason ? String(params.reason) : null,
      status: 'succeeded' as const,
      metadata: asMetadata(params.metadata),
      created: nowSeconds(),
    };
    store.refunds.set(created.id, created);
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded >= charge.amount;
    emit('charge.refunded', { ...charge, refunds: { object: 'list', data: [created] } });
    emit('refund.created', created);
    return created;
  }

  function found<T>(value: T | undefined, kind: string, id: string): T {
    if (!value) throw new RequestError(404, `No such ${kind}: '${id}'`, 'id');
    return value;
  }

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
          throw new RequestError(400, `Keys for idempotent requests can only be used with the same parameters they were first used with.`, undefined, 'idempotency_error');
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
    if (req.method === 'POST' && path === '/v1/checkout/sessions') return answer(200, store.sessionView(createSession(params)));
    if (req.method === 'GET' && (m = path.match(/^\/v1\/checkout\/sessions\/([\w-]+)$/))) {
      return answer(200, store.sessionView(found(store.sessions.get(m[1]), 'checkout.session', m[1])));
    }
    if (req.method === 'POST' && (m = path.match(/^\/v1\/checkout\/sessions\/([\w-]+)\/expire$/))) {
      const s = found(store.sessions.get(m[1]), 'checkout.session', m[1]);
      if (s.status !== 'open') throw new RequestError(400, `Only Checkout Sessions with a status in [open] can be expired.`);
      Object.assign(s, { status: 'expired', url: null });
      emit('checkout.session.expired', store.sessionView(s));
      return answer(200, store.sessionView(s));
    }
    if (req.method === 'GET' && (m = path.match(/^\/v1\/payment_intents\/([\w-]+)$/))) {
      return answer(200, found(store.intents.get(m[1]), 'payment_intent', m[1]));
    }
    if (req.method === 'POST' && path === '/v1/refunds') return answer(200, refund(params));
    if (req.method === 'GET' && (m = path.match(/^\/v1\/refunds\/([\w-]+)$/))) {
      return answer(200, found(store.refunds.get(m[1]), 'refund', m[1]));
    }
    throw new RequestError(404, `Unrecognized request URL (${req.method}: ${path}). This test service answers only the calls Loomwright makes.`);
  }

  async function page(req: IncomingMessage, res: ServerResponse, id: string) {
    const session = store.sessions.get(id);
    if (!session) return sendHtml(res, 404, '<!doctype html><title>Not found</title><p>There is no checkout at this address. Go back to the shop and start the payment again.</p>');
    if (session.status === 'open' && session.expires_at < nowSeconds()) Object.assign(session, { status: 'expired', url: null });
    if (req.method === 'GET') return sendHtml(res, 200, checkoutPage(session));
    const form = new URLSearchParams(await readBody(req));
    if (session.status !== 'open') return sendHtml(res, 409, checkoutPage(session));
    const card = form.get('card') ?? '';
    const result = pay(session, card);
    if (!result.ok) return sendHtml(res, 402, checkoutPage(session, { error: result.message, typed: card }));
    res.writeHead(303, { location: session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id) });
    res.end();
  }

  const server = createServer((req, res) => {
    const path = new URL(req.url ?? '/', 'http://fake').pathname;
    const handle = async () => {
      if (path.startsWith('/v1/')) return api(req, res, path);
      const m = path.match(/^\/pay\/([\w-]+)$/);
      if (m && (req.method === 'GET' || req.method === 'POST')) return page(req, res, m[1]);
      if (path === '/health') return sendJson(res, 200, { status: 'ok' });
      sendJson(res, 404, { error: { type: 'invalid_request_error', message: `Nothing at ${path}.` } });
    };
    handle()
      .catch((error: unknown) => {
        if (res.headersSent) return res.end();
        if (error instanceof RequestError) {
          return sendJson(res, error.status, { error: { type: error.type, message: error.message, ...(error.param ? { param: error.param } : {}) } });
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
  return {
    url: baseUrl,
    port,
    store,
    events,
    webhooks,
    resend(eventId) {
      const event = events.find((e) => e.id === eventId);
      if (!event) throw new Error(`no event ${eventId}`);
      webhooks.send(event);
    },
    close: () =>
      new Promise<void>((resolve) => {
        webhooks.close();
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

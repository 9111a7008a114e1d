import Stripe from 'stripe';

/** An event as the fake sends it: the SDK's own `Stripe.Event`. */
export type FakeEvent = Stripe.Event;

export interface DeliveryAttempt {
  eventId: string;
  attempt: number;
  status: number | null;
  error: string | null;
  at: string;
}

/**
 * Posts each event to the API signed the way the provider signs them (`Stripe-Signature`,
 * HMAC-SHA256 over "timestamp.payload"), so the SDK's constructEvent verifies it. A failed
 * delivery is retried with exponential backoff, as the provider does with its own schedule.
 */
export class WebhookSender {
  private readonly signer = new Stripe('sk_test_fake_signer');
  readonly attempts: DeliveryAttempt[] = [];
  private readonly timers = new Set<NodeJS.Timeout>();
  private closed = false;

  constructor(
    public url: string | undefined,
    private readonly secret: string,
    private readonly retryDelaysMs: number[],
  ) {}

  send(event: FakeEvent): void {
    void this.deliver(event, 1);
  }

  private async deliver(event: FakeEvent, attempt: number): Promise<void> {
    if (!this.url || this.closed) return;
    const payload = JSON.stringify(event);
    const signature = this.signer.webhooks.generateTestHeaderString({ payload, secret: this.secret });
    let status: number | null = null;
    let error: string | null = null;
    try {
      const response = await fetch(this.url, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'stripe-signature': signature },
        body: payload,
        signal: AbortSignal.timeout(10_000),
      });
      status = response.status;
      await response.arrayBuffer();
    } catch (e) {
      error = e instanceof Error ? e.message : String(e);
    }
    this.attempts.push({ eventId: event.id, attempt, status, error, at: new Date().toISOString() });
    const delivered = status !== null && status >= 200 && status < 300;
    if (delivered || attempt > this.retryDelaysMs.length || this.closed) return;
    const timer = setTimeout(
      () => {
        this.timers.delete(timer);
        void this.deliver(event, attempt + 1);
      },
      this.retryDelaysMs[attempt - 1],
    );
    this.timers.add(timer);
  }

  /** Resolves once every event in `ids` has had a 2xx answer (or the time runs out). */
  async settled(ids: string[], timeoutMs = 10_000): Promise<boolean> {
    const end = Date.now() + timeoutMs;
    while (Date.now() < end) {
      const done = ids.every((id) => this.attempts.some((a) => a.eventId === id && a.status !== null && a.status < 300));
      if (done) return true;
      await new Promise((r) => setTimeout(r, 25));
    }
    return false;
  }

  close(): void {
    this.closed = true;
    for (const t of this.timers) clearTimeout(t);
    this.timers.clear();
  }
}

import { BadRequestException, Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import Stripe from 'stripe';
import { BookingsService, type BookingActor } from '../bookings/bookings.service';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { MailService } from '../mail/mail.service';
import { ShopService } from '../shop/shop.service';
import { PaymentsRepository, type PaymentRow } from './payments.repository';
import { PaymentsService } from './payments.service';

const provider: BookingActor = { id: null, label: 'Payment provider' };

/**
 * How far a webhook's signed timestamp may be from our clock, either side: the payment SDK's own
 * default for old events (`Stripe.webhooks.DEFAULT_TOLERANCE`, 300 s), applied to future ones too.
 */
export const WEBHOOK_TOLERANCE_SECONDS = 300;

/** The signed `t=` of a Stripe-Signature header, in Unix seconds (the SDK's header format). */
function signedTimestamp(header: string): number | undefined {
  const field = header.split(',').find((part) => part.trim().startsWith('t='));
  const seconds = field ? Number(field.trim().slice(2)) : Number.NaN;
  return Number.isSafeInteger(seconds) ? seconds : undefined;
}

function clockProblem(header: string, now: number): string | undefined {
  const timestamp = signedTimestamp(header);
  if (timestamp === undefined) return 'The Stripe-Signature header has no timestamp (t=…).';
  const skew = timestamp - Math.floor(now / 1000);
  if (Math.abs(skew) <= WEBHOOK_TOLERANCE_SECONDS) return undefined;
  const side = skew > 0 ? `${skew} seconds ahead of` : `${-skew} seconds behind`;
  return `The webhook was signed ${side} this server's clock; events more than ${WEBHOOK_TOLERANCE_SECONDS} seconds either side are refused as possible replays.`;
}

/**
 * Signed events from the payment provider: the only way a payment becomes paid (the browser's
 * return to the storefront proves nothing). Each event id is handled once, in one transaction
 * with the changes it causes, so a replay or a concurrent duplicate changes nothing.
 */
@Injectable()
export class PaymentWebhooksService {
  private readonly logger = new Logger('PaymentWebhooks');

  constructor(
    private readonly db: Database,
    private readonly stripe: Stripe,
    private readonly config: ConfigService<AppConfig, true>,
    private readonly payments: PaymentsRepository,
    private readonly paymentsService: PaymentsService,
    private readonly bookings: BookingsService,
    private readonly mail: MailService,
    private readonly shop: ShopService,
  ) {}

  verify(rawBody: Buffer | undefined, signature: string | string[] | undefined, now = Date.now()): Stripe.Event {
    if (!rawBody || rawBody.length === 0) throw new BadRequestException('The webhook body is empty.');
    if (typeof signature !== 'string' || !signature) throw new BadRequestException('The Stripe-Signature header is missing.');
    const { webhookSecret } = this.config.get('payments', { infer: true });
    let event: Stripe.Event;
    try {
      // The SDK refuses events older than the tolerance; one from the future it lets through.
      event = this.stripe.webhooks.constructEvent(rawBody, signature, webhookSecret, WEBHOOK_TOLERANCE_SECONDS, undefined, now);
    } catch (error) {
      throw new BadRequestException(
        clockProblem(signature, now) ?? `The webhook signature does not verify: ${error instanceof Error ? error.message : 'unknown reason'}`,
      );
    }
    // A signature made for a time ahead of ours would otherwise stay replayable until then.
    const problem = clockProblem(signature, now);
    if (problem) throw new BadRequestException(problem);
    return event;
  }

  async handle(event: Stripe.Event): Promise<{ received: true; duplicate: boolean }> {
    // Read before the transaction: inside it, every query must use that transaction's connection,
    // or concurrent deliveries could each hold one and wait for a second from an empty pool.
    const shopEmail = event.type === 'checkout.session.completed' ? (await this.shop.profile()).contactEmail : '';
    const fresh = await this.db.transaction().execute(async (trx) => {
      if (!(await this.payments.recordEvent(trx, { id: event.id, type: event.type, payload: event }))) return false;
      switch (event.type) {
        case 'checkout.session.completed':
          await this.sessionCompleted(trx, event.data.object, shopEmail);
          break;
        case 'checkout.session.expired':
          await this.sessionExpired(trx, event.data.object);
          break;
        case 'payment_intent.payment_failed':
          await this.paymentFailed(trx, event.data.object);
          break;
        case 'charge.refunded':
          await this.chargeRefunded(trx, event.data.object);
          break;
        default:
          // Recorded, nothing to do (payment_intent.succeeded, refund.created, …).
          break;
      }
      return true;
    });
    return { received: true, duplicate: !fresh };
  }

  private async sessionCompleted(trx: Executor, session: Stripe.Checkout.Session, shopEmail: string) {
    const payment = await this.payments.lockBySession(trx, session.id);
    if (!payment) {
      this.logger.warn(`checkout ${session.id} completed but no payment row knows it (booking ${session.metadata?.bookingId ?? '?'})`);
      return;
    }
    if (payment.status === 'paid' || payment.status === 'refunded') return;
    if (session.payment_status !== 'paid') return;
    if (session.amount_total !== Number(payment.amount_minor) || session.currency?.toLowerCase() !== payment.currency.trim().toLowerCase()) {
      await this.payments.update(trx, payment.id, {
        failure_message: `The provider reported ${session.amount_total} ${session.currency} for a checkout of ${payment.amount_minor} ${payment.currency}; the shop will check it.`,
      });
      return;
    }
    const intentId = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
    const paid = await this.payments.update(trx, payment.id, {
      status: 'paid',
      paid_at: new Date(),
      payment_intent_id: intentId,
      failure_message: null,
    });
    if (paid.kind === 'deposit') await this.depositPaid(trx, paid, shopEmail);
    else await this.balancePaid(trx, paid);
  }

  private async depositPaid(trx: Executor, payment: PaymentRow, shopEmail: string) {
    const booking = await this.bookings.lock(trx, payment.booking_id);
    if (!booking) return;
    if (booking.state !== 'requested') {
      // Paid after the request was withdrawn or declined: the money goes straight back.
      await this.paymentsService.refundDeposit(trx, booking.id, provider, `Deposit arrived after the booking was ${booking.state}.`);
      return;
    }
    await this.bookings.transition(trx, booking.id, ['requested'], 'deposit_paid', provider, `Deposit of ${payment.amount} ${payment.currency.trim()} received.`);
    const detail = await this.bookings.getDetail(booking.id, trx);
    const publicUrl = this.config.get('app', { infer: true }).publicUrl;
    const data = {
      name: detail.customer.name,
      customerEmail: detail.customer.email,
      reference: detail.reference,
      amount: payment.amount,
      currency: payment.currency.trim(),
      totalLow: detail.totalLow,
      totalHigh: detail.totalHigh,
      summary: detail.summary,
      buildUrl: `${publicUrl}/builds/${detail.id}`,
      backofficeUrl: `${publicUrl}/backoffice/requests`,
    };
    await this.mail.enqueue(trx, {
      template: 'deposit-received',
      to: detail.customer.email,
      bookingId: detail.id,
      userId: detail.customer.id,
      data,
      dedupeKey: `deposit-received:${payment.id}`,
    });
    await this.mail.enqueue(trx, {
      template: 'shop-new-paid-request',
      to: shopEmail,
      bookingId: detail.id,
      data,
      dedupeKey: `shop-new-paid-request:${payment.id}`,
    });
  }

  private async balancePaid(trx: Executor, payment: PaymentRow) {
    const booking = await this.bookings.lock(trx, payment.booking_id);
    if (!booking) return;
    // The state stays "ready": the shop ships or hands over, then marks it delivered.
    await this.bookings.transition(trx, booking.id, [booking.state], booking.state, provider, `Balance of ${payment.amount} ${payment.currency.trim()} received.`);
  }

  private async sessionExpired(trx: Executor, session: Stripe.Checkout.Session) {
    const payment = await this.payments.lockBySession(trx, session.id);
    if (payment && (payment.status === 'pending' || payment.status === 'failed')) {
      await this.payments.update(trx, payment.id, { status: 'expired' });
    }
  }

  private async paymentFailed(trx: Executor, intent: Stripe.PaymentIntent) {
    const paymentId = intent.metadata?.paymentId;
    const payment = paymentId ? await this.payments.lockById(trx, paymentId) : await this.payments.lockByIntent(trx, intent.id);
    if (!payment || payment.status === 'paid' || payment.status === 'refunded' || payment.status === 'expired') return;
    const reason = intent.last_payment_error?.message ?? 'The card was declined.';
    await this.payments.update(trx, payment.id, { status: 'failed', failure_message: reason, payment_intent_id: intent.id });
  }

  private async chargeRefunded(trx: Executor, charge: Stripe.Charge) {
    const intentId = typeof charge.payment_intent === 'string' ? charge.payment_intent : charge.payment_intent?.id;
    if (!intentId) return;
    const payment = await this.payments.lockByIntent(trx, intentId);
    if (!payment || payment.status !== 'paid' || !charge.refunded) return;
    const refunded = await this.payments.update(trx, payment.id, {
      status: 'refunded',
      refunded_at: new Date(),
      refund_id: charge.refunds?.data?.[0]?.id ?? payment.refund_id,
    });
    if (refunded.kind === 'deposit') await this.paymentsService.mailRefund(trx, refunded);
  }
}

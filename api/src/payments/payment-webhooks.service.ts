import { fromProviderAmount } from '@loomwright/shared';
import { BadRequestException, Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import Stripe from 'stripe';
import { BookingsService } from '../bookings/bookings.service';
import { moneyOf } from '../common/shop-voice';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { retryOnDeadlock } from '../database/retry-on-deadlock';
import { MailService } from '../mail/mail.service';
import { ShopService } from '../shop/shop.service';
import { PaymentsRepository, type PaymentRow } from './payments.repository';
import { PaymentsService, providerActor as provider } from './payments.service';

/**
 * The events Loomwright acts on. The README's "Running on real keys" lists the same names: the
 * provider's webhook endpoint must send each of them. Anything else is recorded and left alone.
 */
export const handledEvents = [
  'checkout.session.completed',
  'checkout.session.async_payment_succeeded',
  'checkout.session.async_payment_failed',
  'checkout.session.expired',
  'payment_intent.payment_failed',
  'refund.created',
  'refund.updated',
  'refund.failed',
  'charge.refund.updated',
  'charge.dispute.created',
  'charge.dispute.updated',
  'charge.dispute.closed',
] as const satisfies readonly Stripe.Event['type'][];

const intentIdOf = (v: string | { id: string } | null | undefined) => (typeof v === 'string' ? v : (v?.id ?? null));

const disputeWords = (reason: string | null | undefined) => (reason ?? 'general').replace(/_/g, ' ');

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
 * with the changes it causes and their history lines, so a replay or a concurrent duplicate
 * changes nothing; each handler also checks the payment's own state, so two events that report
 * the same change (a refund's refund.updated and refund.failed) change it once.
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
        clockProblem(signature, now) ??
          `The webhook signature does not verify: ${error instanceof Error ? error.message : 'unknown reason'}`,
      );
    }
    // A signature made for a time ahead of ours would otherwise stay replayable until then.
    const problem = clockProblem(signature, now);
    if (problem) throw new BadRequestException(problem);
    return event;
  }

  async handle(event: Stripe.Event): Promise<{ received: true; duplicate: boolean }> {
    if (event.api_version && event.api_version !== Stripe.API_VERSION) {
      // Object shapes follow the endpoint's API version: a mismatch is a setup mistake (README, "Running on real keys").
      this.logger.warn(`event ${event.id} uses API version ${event.api_version}; this build of the SDK pins ${Stripe.API_VERSION}`);
    }
    // Read before the transaction: inside it, every query must use that transaction's connection,
    // or concurrent deliveries could each hold one and wait for a second from an empty pool.
    const shopEmail =
      event.type === 'checkout.session.completed' || event.type === 'checkout.session.async_payment_succeeded'
        ? (await this.shop.profile()).contactEmail
        : '';
    const failure = event.type === 'checkout.session.async_payment_failed' ? await this.intentFailure(event.data.object) : '';
    const known = await this.paymentOfIntent(event);
    // A webhook locks its payment before the booking while the shop's own actions lock the booking
    // first (and a deposit's change writes the booking's deposit word by trigger), so the two can
    // deadlock. PostgreSQL then rolls one back whole, the event's record included: trying the event
    // again is safe (a refund inside is idempotent by its key), and the provider needn't redeliver.
    const fresh = await retryOnDeadlock(() =>
      this.db.transaction().execute(async (trx) => {
        if (!(await this.payments.recordEvent(trx, { id: event.id, type: event.type, payload: event }))) return false;
        switch (event.type) {
          case 'checkout.session.completed':
          case 'checkout.session.async_payment_succeeded':
            await this.sessionSettled(trx, event.data.object, shopEmail);
            break;
          case 'checkout.session.async_payment_failed':
            await this.sessionFailed(trx, event.data.object, failure);
            break;
          case 'checkout.session.expired':
            await this.sessionExpired(trx, event.data.object);
            break;
          case 'payment_intent.payment_failed':
            await this.paymentFailed(trx, event.data.object);
            break;
          case 'refund.created':
          case 'refund.updated':
          case 'refund.failed':
          case 'charge.refund.updated':
            await this.refundChanged(trx, event.data.object, known);
            break;
          case 'charge.dispute.created':
          case 'charge.dispute.updated':
          case 'charge.dispute.closed':
            await this.disputeChanged(trx, event.data.object, known);
            break;
          default:
            // Recorded, nothing to do (payment_intent.succeeded, charge.refunded, …): the events
            // above carry every change Loomwright keeps.
            break;
        }
        return true;
      }),
    );
    return { received: true, duplicate: !fresh };
  }

  /**
   * Which payment a refund or dispute event is about. Usually its intent id is on the payment row;
   * when the event overtakes the checkout's own (the row has no intent id yet), the intent's
   * metadata names the payment. Read before the transaction, like every provider call.
   */
  private async paymentOfIntent(event: Stripe.Event): Promise<string | undefined> {
    const object =
      event.type.startsWith('refund.') || event.type.startsWith('charge.dispute.') || event.type === 'charge.refund.updated'
        ? (event.data.object as Stripe.Refund | Stripe.Dispute)
        : undefined;
    const intentId = object ? intentIdOf(object.payment_intent) : null;
    if (!intentId) return undefined;
    const known = await this.payments.idOfIntent(intentId);
    if (known) return known;
    try {
      return (await this.stripe.paymentIntents.retrieve(intentId)).metadata?.paymentId || undefined;
    } catch (error) {
      this.logger.warn(`could not read payment intent ${intentId}: ${error instanceof Error ? error.message : String(error)}`);
      return undefined;
    }
  }

  /** Locks the payment an event names, and notes its intent id if the checkout's own event has not yet. */
  private async lockForIntent(trx: Executor, intentId: string | null, paymentId: string | undefined) {
    const payment = paymentId
      ? await this.payments.lockById(trx, paymentId)
      : intentId
        ? await this.payments.lockByIntent(trx, intentId)
        : undefined;
    if (payment && !payment.payment_intent_id && intentId) return this.payments.update(trx, payment.id, { payment_intent_id: intentId });
    return payment;
  }

  /** The bank's reason for a failed debit, from the intent (read before the transaction). */
  private async intentFailure(session: Stripe.Checkout.Session): Promise<string> {
    const id = intentIdOf(session.payment_intent);
    if (!id) return '';
    try {
      const intent = await this.stripe.paymentIntents.retrieve(id);
      return intent.last_payment_error?.message ?? '';
    } catch (error) {
      this.logger.warn(`could not read payment intent ${id}: ${error instanceof Error ? error.message : String(error)}`);
      return '';
    }
  }

  private async payment(trx: Executor, session: Stripe.Checkout.Session) {
    const payment = await this.payments.lockBySession(trx, session.id);
    if (!payment)
      this.logger.warn(`checkout ${session.id} reported but no payment row knows it (booking ${session.metadata?.bookingId ?? '?'})`);
    return payment;
  }

  /** checkout.session.completed (paid, or a bank debit still settling) and async_payment_succeeded. */
  private async sessionSettled(trx: Executor, session: Stripe.Checkout.Session, shopEmail: string) {
    const payment = await this.payment(trx, session);
    if (!payment || payment.status === 'paid' || payment.status === 'refunded') return;
    if (
      session.amount_total !== Number(payment.amount_minor) ||
      session.currency?.toLowerCase() !== payment.currency.trim().toLowerCase()
    ) {
      await this.payments.update(trx, payment.id, {
        failure_message: `The provider reported ${session.amount_total} ${session.currency} for a checkout of ${payment.amount_minor} ${payment.currency}; the shop will check it.`,
      });
      return;
    }
    const intentId = intentIdOf(session.payment_intent);
    if (session.payment_status !== 'paid') {
      // A bank debit: the checkout is done, the money is not here yet.
      if (payment.status === 'processing' || payment.status === 'failed') return;
      await this.payments.update(trx, payment.id, { status: 'processing', payment_intent_id: intentId, failure_message: null });
      await this.paymentsService.historyNote(
        trx,
        payment.booking_id,
        provider,
        `${payment.kind === 'deposit' ? 'Deposit' : 'Balance'} of ${moneyOf(payment)} paid by bank debit; it settles in a few working days, and the booking moves on once it has.`,
      );
      return;
    }
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
    await this.bookings.transition(trx, booking.id, ['requested'], 'deposit_paid', provider, `Deposit of ${moneyOf(payment)} received.`);
    const detail = await this.bookings.getDetail(booking.id, trx);
    const publicUrl = this.config.get('app', { infer: true }).publicUrl;
    const paid = { name: detail.customer.name, reference: detail.reference, amount: payment.amount, currency: payment.currency.trim() };
    await this.mail.enqueue(trx, {
      template: 'deposit-received',
      to: detail.customer.email,
      bookingId: detail.id,
      userId: detail.customer.id,
      data: { ...paid, bookingUrl: `${publicUrl}/builds/${detail.id}` },
      dedupeKey: `deposit-received:${payment.id}`,
    });
    await this.mail.enqueue(trx, {
      template: 'shop-new-paid-request',
      to: shopEmail,
      bookingId: detail.id,
      data: {
        ...paid,
        customerEmail: detail.customer.email,
        totalLow: detail.totalLow,
        totalHigh: detail.totalHigh,
        backofficeUrl: `${publicUrl}/backoffice/requests`,
      },
      dedupeKey: `shop-new-paid-request:${payment.id}`,
    });
  }

  private async balancePaid(trx: Executor, payment: PaymentRow) {
    // The state stays "ready": the shop ships or hands over, then marks it delivered.
    await this.paymentsService.historyNote(trx, payment.booking_id, provider, `Balance of ${moneyOf(payment)} received.`);
  }

  /** checkout.session.async_payment_failed: the debit did not go through; the player is told and can pay again. */
  private async sessionFailed(trx: Executor, session: Stripe.Checkout.Session, reason: string) {
    const payment = await this.payment(trx, session);
    if (payment) await this.delayedFailure(trx, payment, reason || 'The bank did not complete the debit.');
  }

  private async delayedFailure(trx: Executor, payment: PaymentRow, reason: string) {
    if (payment.status !== 'processing') return;
    const failed = await this.payments.update(trx, payment.id, { status: 'failed', failure_message: reason });
    const what = payment.kind === 'deposit' ? 'Deposit' : 'Balance';
    await this.paymentsService.historyNote(
      trx,
      payment.booking_id,
      provider,
      `${what} bank debit of ${moneyOf(payment)} failed: ${reason} Nothing was taken; the player has been asked to pay again.`,
    );
    const detail = await this.bookings.getDetail(payment.booking_id, trx);
    const publicUrl = this.config.get('app', { infer: true }).publicUrl;
    await this.mail.enqueue(trx, {
      template: 'payment-failed',
      to: detail.customer.email,
      bookingId: detail.id,
      userId: detail.customer.id,
      data: {
        name: detail.customer.name,
        reference: detail.reference,
        amount: failed.amount,
        currency: failed.currency.trim(),
        reason,
        kind: failed.kind,
        bookingUrl: `${publicUrl}/builds/${detail.id}`,
      },
      dedupeKey: `payment-failed:${payment.id}`,
    });
  }

  private async sessionExpired(trx: Executor, session: Stripe.Checkout.Session) {
    const payment = await this.payments.lockBySession(trx, session.id);
    if (!payment || (payment.status !== 'pending' && payment.status !== 'failed')) return;
    await this.payments.update(trx, payment.id, { status: 'expired' });
    const booking = await this.bookings.lock(trx, payment.booking_id);
    // A withdrawn request's checkout closing needs no line of its own.
    if (!booking || !['requested', 'ready'].includes(booking.state)) return;
    await this.paymentsService.historyNote(
      trx,
      payment.booking_id,
      provider,
      `The ${payment.kind} checkout of ${moneyOf(payment)} closed unpaid when its time ran out; nothing was taken, and the player can pay again from the build page.`,
    );
  }

  /** A card declined on an open checkout (the player can retry on the same page), or a bank debit that failed later. */
  private async paymentFailed(trx: Executor, intent: Stripe.PaymentIntent) {
    const paymentId = intent.metadata?.paymentId;
    const payment = paymentId ? await this.payments.lockById(trx, paymentId) : await this.payments.lockByIntent(trx, intent.id);
    if (!payment) return;
    const reason = intent.last_payment_error?.message ?? 'The card was declined.';
    if (payment.status === 'processing') return this.delayedFailure(trx, payment, reason);
    // A bank debit's later failure is reported twice (this event and checkout.session.async_payment_failed), in
    // either order: when the other one has already recorded this very failure, there is nothing new to say.
    if (payment.status === 'failed' && payment.failure_message === reason) return;
    if (payment.status !== 'pending' && payment.status !== 'failed') return;
    await this.payments.update(trx, payment.id, { status: 'failed', failure_message: reason, payment_intent_id: intent.id });
    await this.paymentsService.historyNote(
      trx,
      payment.booking_id,
      provider,
      `Card declined at checkout: ${reason} The checkout stays open for another try.`,
    );
  }

  /** Any refund's news (ours, or one made in the provider's dashboard): recorded against its payment. */
  private async refundChanged(trx: Executor, refund: Stripe.Refund, known: string | undefined) {
    const intentId = intentIdOf(refund.payment_intent);
    const payment = await this.lockForIntent(trx, intentId, refund.metadata?.paymentId || known);
    if (!payment) {
      this.logger.warn(`refund ${refund.id} of ${intentId ?? 'an unknown payment'} matches no payment`);
      return;
    }
    await this.paymentsService.recordRefund(trx, payment.id, refund);
  }

  /** A chargeback: opened, updated, won or lost. The owner is told at once; delivery waits on their decision. */
  private async disputeChanged(trx: Executor, dispute: Stripe.Dispute, known: string | undefined) {
    const intentId = intentIdOf(dispute.payment_intent);
    const payment = await this.lockForIntent(trx, intentId, known);
    if (!payment) {
      this.logger.warn(`dispute ${dispute.id} of ${intentId ?? 'an unknown payment'} matches no payment`);
      return;
    }
    if (payment.dispute_id === dispute.id && payment.dispute_status === dispute.status) return;
    const isNew = payment.dispute_id !== dispute.id;
    const amount = `${fromProviderAmount(dispute.amount, payment.currency.trim())} ${payment.currency.trim()}`;
    const updated = await this.payments.update(trx, payment.id, {
      dispute_id: dispute.id,
      dispute_status: dispute.status,
      dispute_reason: dispute.reason,
      dispute_amount_minor: dispute.amount,
      ...(isNew ? { dispute_opened_at: new Date(dispute.created * 1000), dispute_released_at: null, dispute_released_by: null } : {}),
    });
    const what = payment.kind === 'deposit' ? 'deposit' : 'balance';
    if (dispute.status === 'won' || dispute.status === 'warning_closed') {
      await this.paymentsService.historyNote(
        trx,
        payment.booking_id,
        provider,
        `The bank decided the dispute over the ${what} for the shop; the ${amount} stays. Delivery waits until the owner releases it.`,
      );
      await this.paymentsService.alertOwner(
        trx,
        updated,
        'dispute-won',
        `The dispute (${disputeWords(dispute.reason)}) over ${amount} was decided for the shop.`,
        dispute.status,
      );
      return;
    }
    if (dispute.status === 'lost') {
      await this.paymentsService.historyNote(
        trx,
        payment.booking_id,
        provider,
        `The bank decided the dispute over the ${what} for the player; ${amount} was taken back. Delivery waits on the owner's decision.`,
      );
      await this.paymentsService.alertOwner(
        trx,
        updated,
        'dispute-lost',
        `The dispute (${disputeWords(dispute.reason)}) over ${amount} was decided for the player; the money was taken back.`,
        'lost',
      );
      return;
    }
    if (isNew) {
      await this.paymentsService.historyNote(
        trx,
        payment.booking_id,
        provider,
        `The player's bank disputed the ${what} of ${amount} (${disputeWords(dispute.reason)}). The owner has been told; delivery waits on the owner's decision.`,
      );
      await this.paymentsService.alertOwner(
        trx,
        updated,
        'dispute-opened',
        `The player's bank disputed ${amount} (${disputeWords(dispute.reason)}); the answer is due by ${dispute.evidence_details?.due_by ? new Date(dispute.evidence_details.due_by * 1000).toISOString().slice(0, 10) : 'the date in the provider dashboard'}.`,
        'opened',
      );
      return;
    }
    await this.paymentsService.historyNote(
      trx,
      payment.booking_id,
      provider,
      `The dispute over the ${what} is now "${dispute.status.replace(/_/g, ' ')}".`,
    );
  }
}

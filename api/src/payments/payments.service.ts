import { randomUUID } from 'node:crypto';
import { BadGatewayException, BadRequestException, ConflictException, Injectable, Logger, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { errorResponse, type AuthUser, type BookingDetail, type BookingState } from '@loomwright/shared';
import {
  bookingStateLabels,
  formatMoney,
  paymentMethodWords,
  type RecordBalanceInput,
  toProviderAmount,
  fromProviderAmount,
} from '@loomwright/shared';
import Stripe from 'stripe';
import { actorOf, BookingsService, type BookingActor } from '../bookings/bookings.service';
import { moneyOf } from '../common/shop-voice';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { MailService } from '../mail/mail.service';
import { PaymentsRepository, type PaymentRow } from './payments.repository';

export type PaymentKind = PaymentRow['kind'];

/** The timeline's name for what the provider reports. */
export const providerActor: BookingActor = { id: null, label: 'Payment provider' };

/** A player may cancel until the shop sets a bench date (the demo shop's deposit policy). */
const cancellableStates: BookingState[] = ['requested', 'deposit_paid'];
const refundableStates: BookingState[] = ['deposit_paid', 'scheduled', 'declined', 'cancelled'];
const scheduledOrLater: BookingState[] = ['scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered'];

/**
 * Currencies of the payment method types that take only some (the provider's payment method
 * documentation: US bank account debits settle in usd, SEPA Direct Debit in eur); any type not
 * listed here (card, …) is offered whatever the currency, and the provider judges it.
 */
const methodCurrencies: Record<string, string[]> = { us_bank_account: ['usd'], sepa_debit: ['eur'] };

/** Words for a provider refund status, for history lines and the owner's alert. */
const refundFailureWords: Record<string, string> = {
  lost_or_stolen_card: 'the card was reported lost or stolen',
  expired_or_canceled_card: 'the card has expired or was cancelled',
  charge_for_pending_refund_disputed: 'the charge was disputed while the refund was pending',
  insufficient_funds: 'the shop account had too little balance',
  declined: 'the bank declined it',
  merchant_request: 'the shop cancelled it',
  unknown: 'no reason given',
};
export const refundFailureText = (reason: string | null | undefined) =>
  reason ? (refundFailureWords[reason] ?? reason.replace(/_/g, ' ')) : 'no reason given';

/** A dispute that the bank has not decided for the shop: the money may not stay, so it is not refunded. */
export const disputeOpen = (p: PaymentRow) => !!p.dispute_id && !['won', 'warning_closed'].includes(p.dispute_status ?? '');

@Injectable()
export class PaymentsService {
  private readonly logger = new Logger('Payments');

  constructor(
    private readonly db: Database,
    private readonly stripe: Stripe,
    private readonly bookings: BookingsService,
    private readonly payments: PaymentsRepository,
    private readonly mail: MailService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  private returnUrl(bookingId: string, result: 'paid' | 'cancelled') {
    const base = this.config.get('app', { infer: true }).publicUrl;
    return `${base}/checkout/return?booking=${encodeURIComponent(bookingId)}&result=${result}`;
  }

  /**
   * The hosted checkout for what the booking owes now: the deposit while it is requested, the
   * balance once it is ready. The booking row is locked while we look for an open session and
   * create one, so concurrent clicks queue up and all get the same session; the idempotency key
   * (booking + kind + attempt) makes a retried create return the provider's first answer.
   */
  async checkout(user: AuthUser, bookingId: string): Promise<{ url: string; paymentId: string }> {
    await this.bookings.findVisible(user, bookingId);
    if (user.role !== 'customer') throw new ConflictException("Only the booking's player pays through checkout.");
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, bookingId);
      if (!booking) throw new NotFoundException(`There is no booking ${bookingId}.`);
      const kind: PaymentKind | null = booking.state === 'requested' ? 'deposit' : booking.state === 'ready' ? 'balance' : null;
      if (!kind) {
        throw new ConflictException(
          errorResponse(
            'nothing_due',
            `Booking ${booking.reference} is "${bookingStateLabels[booking.state]}": nothing is due now. The deposit is paid while a build is requested, the balance once it is ready.`,
          ),
        );
      }
      const previous = await this.payments.listForBooking(trx, bookingId, kind);
      if (previous.some((p) => p.status === 'paid'))
        throw new ConflictException(errorResponse('nothing_due', `The ${kind} for ${booking.reference} is already paid.`));
      const settling = () =>
        new ConflictException(
          errorResponse(
            'payment_settling',
            `Your bank payment for ${booking.reference} is still settling (bank debits take a few working days); we will e-mail you as soon as it has. Nothing more is due until then.`,
          ),
        );
      if (previous.some((p) => p.status === 'processing')) throw settling();
      for (const p of previous.filter((row) => row.status === 'pending' || row.status === 'failed')) {
        const session = await this.retrieveSession(p.checkout_session_id!);
        // An open session (even after a declined card) is the one to finish; a second would risk two charges.
        if (session.status === 'open' && session.url) return { url: session.url, paymentId: p.id };
        if (session.status === 'complete') {
          // Paid, the webhook on its way: the same page says so.
          if (session.payment_status === 'paid' && p.checkout_url) return { url: p.checkout_url, paymentId: p.id };
          // A bank debit started here and has not reported back yet.
          if (p.status === 'pending') throw settling();
          // A debit that failed after its checkout: that session is spent; a new one follows.
          continue;
        }
        await this.payments.update(trx, p.id, { status: 'expired' });
      }

      const detail = await this.bookings.getDetail(bookingId, trx);
      const { amount, currency, label } = this.amountDue(kind, detail);
      const attempt = previous.length + 1;
      const paymentId = randomUUID();
      const customer = await this.payments.findCustomer(trx, booking.customer_id);
      const metadata = { bookingId, paymentId, kind, reference: booking.reference };
      const session = await this.call(() =>
        this.stripe.checkout.sessions.create(
          {
            mode: 'payment',
            line_items: [
              {
                quantity: 1,
                price_data: {
                  currency: currency.toLowerCase(),
                  unit_amount: toProviderAmount(amount, currency),
                  product_data: { name: `${label}, build ${booking.reference}`, description: detail.summary },
                },
              },
            ],
            metadata,
            payment_method_types: this.methodTypes(currency),
            payment_intent_data: { metadata },
            client_reference_id: bookingId,
            customer_email: customer.email,
            success_url: this.returnUrl(bookingId, 'paid'),
            cancel_url: this.returnUrl(bookingId, 'cancelled'),
          },
          { idempotencyKey: `checkout:${bookingId}:${kind}:${attempt}` },
        ),
      );
      if (!session.url) throw new BadGatewayException('The payment provider did not return a checkout page; try again in a minute.');
      await this.payments.insert(trx, {
        id: paymentId,
        booking_id: bookingId,
        kind,
        amount,
        amount_minor: toProviderAmount(amount, currency),
        currency,
        status: 'pending',
        checkout_session_id: session.id,
        checkout_url: session.url,
      });
      return { url: session.url, paymentId };
    });
  }

  /** The configured ways of paying that take this currency (a bank debit takes only its own). */
  private methodTypes(currency: string): string[] {
    const code = currency.trim().toLowerCase();
    const types = this.config
      .get('payments', { infer: true })
      .methodTypes.filter((t) => !methodCurrencies[t] || methodCurrencies[t].includes(code));
    return types.length > 0 ? types : ['card'];
  }

  private amountDue(kind: PaymentKind, detail: BookingDetail) {
    if (kind === 'deposit') return { amount: detail.quote.deposit, currency: detail.quote.currency, label: 'Deposit' };
    if (!detail.balanceDue || Number(detail.balanceDue) <= 0) {
      throw new ConflictException(errorResponse('nothing_due', `Booking ${detail.reference} has no balance to pay.`));
    }
    return { amount: detail.balanceDue, currency: detail.firmQuote?.currency ?? detail.currency, label: 'Balance' };
  }

  private retrieveSession(id: string) {
    return this.call(() => this.stripe.checkout.sessions.retrieve(id));
  }

  /** Provider trouble is not the caller's fault: a 502 in words, never a bare 500. */
  private async call<T>(fn: () => Promise<T>): Promise<T> {
    try {
      return await fn();
    } catch (error) {
      if (error instanceof Stripe.errors.StripeError) {
        this.logger.warn(`payment provider: ${error.type} ${error.message}`);
        throw new BadGatewayException(`The payment provider refused the request: ${error.message}`);
      }
      throw error;
    }
  }

  /**
   * Refunds the booking's paid deposit through the provider and records the provider's answer.
   * One refund is under way at a time: while one is pending this returns the row unchanged; after
   * one failed, the next attempt gets its own idempotency key. Only a refund the provider reports
   * `succeeded` marks the payment refunded and mails the player (the money is on its way); a
   * pending one waits for its refund.updated event, a failed one tells the owner. Returns null
   * when there is no paid deposit to refund.
   */
  async refundDeposit(trx: Executor | undefined, bookingId: string, actor: BookingActor, reason: string): Promise<PaymentRow | null> {
    if (!trx) return this.db.transaction().execute((t) => this.refundDeposit(t, bookingId, actor, reason));
    const paid = (await this.payments.listForBooking(trx, bookingId, 'deposit')).find((p) => p.status === 'paid');
    if (!paid) return null;
    const locked = await this.payments.lockById(trx, paid.id);
    if (!locked || locked.status !== 'paid' || !locked.payment_intent_id) return null;
    if (locked.refund_status === 'pending' || locked.refund_status === 'requires_action') return locked;
    if (disputeOpen(locked)) {
      throw new ConflictException(
        errorResponse(
          'deposit_disputed',
          `The deposit of ${moneyOf(locked)} is disputed by the player's bank, which is deciding where the money goes; it cannot be refunded until the dispute closes.`,
        ),
      );
    }
    const attempt = locked.refund_attempts + 1;
    const refund = await this.call(() =>
      this.stripe.refunds.create(
        {
          payment_intent: locked.payment_intent_id!,
          reason: 'requested_by_customer',
          metadata: { bookingId, paymentId: locked.id, by: actor.label.slice(0, 200), note: reason.slice(0, 400) },
        },
        { idempotencyKey: attempt === 1 ? `refund:${locked.id}` : `refund:${locked.id}:${attempt}` },
      ),
    );
    await this.payments.update(trx, locked.id, { refund_attempts: attempt });
    return this.recordRefund(trx, locked.id, refund, actor);
  }

  /**
   * Applies what the provider says of a refund (its create answer or a refund event) to the
   * payment, once per change of status, with its history line: succeeded → refunded and the
   * player mailed; pending → waiting; failed or canceled → still paid, the owner told at once.
   */
  async recordRefund(trx: Executor, paymentId: string, refund: Stripe.Refund, actor: BookingActor = providerActor): Promise<PaymentRow> {
    const payment = (await this.payments.lockById(trx, paymentId))!;
    const status = (refund.status ?? 'pending') as NonNullable<PaymentRow['refund_status']>;
    const sameRefund = payment.refund_id === refund.id;
    if (sameRefund && payment.refund_status === status) return payment;
    // An older refund's late news must not undo a newer one's.
    if (
      !sameRefund &&
      payment.refund_id &&
      payment.refund_status !== 'failed' &&
      payment.refund_status !== 'canceled' &&
      status !== 'succeeded'
    ) {
      return payment;
    }
    const ours = refund.metadata?.paymentId === payment.id;
    const amount = fromProviderAmount(refund.amount, payment.currency.trim());
    const whole = refund.amount >= Number(payment.amount_minor);
    const where = ours ? '' : " in the payment provider's dashboard";
    const kindWord = payment.kind === 'deposit' ? 'deposit' : 'balance';
    if (status === 'succeeded') {
      const updated = await this.payments.update(trx, payment.id, {
        refund_id: refund.id,
        refund_status: 'succeeded',
        refund_failure: null,
        ...(whole && payment.status === 'paid' ? { status: 'refunded' as const, refunded_at: new Date() } : {}),
      });
      await this.historyNote(
        trx,
        payment.booking_id,
        actor,
        `${whole ? 'Refund' : 'Part refund'} of ${amount} ${payment.currency.trim()} of the ${kindWord} made${where}; the money is on its way to the player.`,
      );
      if (whole && updated.kind === 'deposit') await this.mailRefund(trx, updated);
      if (!ours)
        await this.alertOwner(
          trx,
          updated,
          'outside-refund',
          `${whole ? 'A refund' : 'A part refund'} of ${amount} ${payment.currency.trim()} was made in the provider's dashboard (refund ${refund.id}).`,
        );
      return updated;
    }
    if (status === 'failed' || status === 'canceled') {
      const failure = refundFailureText(refund.failure_reason);
      const updated = await this.payments.update(trx, payment.id, {
        refund_id: refund.id,
        refund_status: status,
        refund_failure: failure,
        // Marked refunded on an earlier "succeeded"? The money came back to the shop.
        ...(payment.status === 'refunded' ? { status: 'paid' as const, refunded_at: null } : {}),
      });
      await this.historyNote(
        trx,
        payment.booking_id,
        actor,
        `Refund of ${amount} ${payment.currency.trim()} of the ${kindWord} ${status === 'failed' ? 'failed' : 'was cancelled'}: ${failure}. The money is still with the shop; the owner has been told.`,
      );
      await this.alertOwner(
        trx,
        updated,
        'refund-failed',
        `The refund of ${amount} ${payment.currency.trim()} ${status === 'failed' ? 'failed' : 'was cancelled'}: ${failure}.`,
      );
      return updated;
    }
    const updated = await this.payments.update(trx, payment.id, { refund_id: refund.id, refund_status: status, refund_failure: null });
    await this.historyNote(
      trx,
      payment.booking_id,
      actor,
      `Refund of ${amount} ${payment.currency.trim()} of the ${kindWord} asked of the payment provider${where}; it is ${status === 'requires_action' ? 'waiting for details from the player' : 'pending'}, and the player is mailed once the money is on its way.`,
    );
    return updated;
  }

  async mailRefund(trx: Executor, payment: PaymentRow) {
    const booking = await this.bookings.getDetail(payment.booking_id, trx);
    await this.mail.enqueue(trx, {
      template: 'deposit-refunded',
      to: booking.customer.email,
      bookingId: booking.id,
      userId: booking.customer.id,
      data: { name: booking.customer.name, reference: booking.reference, amount: payment.amount, currency: payment.currency.trim() },
      dedupeKey: `deposit-refunded:${payment.id}:${payment.refund_id ?? ''}`,
    });
  }

  /** A line on the booking's timeline without a change of state. */
  async historyNote(trx: Executor, bookingId: string, actor: BookingActor, note: string) {
    const booking = await this.bookings.lock(trx, bookingId);
    if (!booking) return;
    await this.bookings.insertNote(trx, booking, actor, note);
  }

  /** Tells the owner at once (every owner account) that money needs a decision. */
  async alertOwner(
    trx: Executor,
    payment: PaymentRow,
    alert: 'refund-failed' | 'dispute-opened' | 'dispute-won' | 'dispute-lost' | 'outside-refund',
    detail: string,
    dedupe = '',
  ) {
    const booking = await this.bookings.getDetail(payment.booking_id, trx);
    const publicUrl = this.config.get('app', { infer: true }).publicUrl;
    for (const to of await this.payments.ownerAddresses(trx)) {
      await this.mail.enqueue(trx, {
        template: 'shop-payment-alert',
        to,
        bookingId: booking.id,
        data: {
          name: booking.customer.name,
          alert,
          reference: booking.reference,
          amount: payment.amount,
          currency: payment.currency.trim(),
          detail,
          backofficeUrl: `${publicUrl}/backoffice/requests/${booking.id}`,
        },
        dedupeKey: `shop-payment-alert:${alert}:${payment.id}:${dedupe || (payment.refund_id ?? payment.dispute_id ?? '')}:${to}`,
      });
    }
  }

  /** The owner decides that a disputed build may be delivered anyway; the timeline says why. */
  async releaseDispute(user: AuthUser, bookingId: string, note: string) {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, bookingId);
      if (!booking) throw new NotFoundException(`There is no booking ${bookingId}.`);
      const held = (await this.payments.listForBooking(trx, bookingId)).filter((p) => p.dispute_id && !p.dispute_released_at);
      if (held.length === 0) throw new ConflictException(`Booking ${booking.reference} has no disputed payment holding its delivery.`);
      for (const p of held) await this.payments.update(trx, p.id, { dispute_released_at: new Date(), dispute_released_by: user.name });
      await this.historyNote(trx, bookingId, actorOf(user), `Delivery released despite the dispute: ${note}`);
    });
    return this.bookings.getDetail(bookingId);
  }

  /** The player withdraws a request before it is scheduled; a paid deposit goes back to them. */
  async cancel(user: AuthUser, bookingId: string, reason: string | undefined) {
    const booking = await this.bookings.findVisible(user, bookingId);
    await this.db.transaction().execute(async (trx) => {
      const locked = await this.bookings.lock(trx, booking.id);
      // Past the point of a player's own cancel (a cancelled or declined one stays a plain conflict below).
      if (locked && scheduledOrLater.includes(locked.state)) {
        throw new ConflictException(
          errorResponse(
            'too_late_to_cancel',
            `Booking ${locked.reference} is "${bookingStateLabels[locked.state]}"; a request can be cancelled here only until the shop schedules it. Write to the shop on the build page to ask for a cancellation.`,
          ),
        );
      }
      const note = reason?.trim() || 'Cancelled by the player.';
      await this.bookings.transition(trx, booking.id, cancellableStates, 'cancelled', actorOf(user), note);
      await this.bookings.update(trx, booking.id, { cancel_reason: note });
      // An open checkout must not be payable once the request is withdrawn.
      for (const p of await this.payments.listForBooking(trx, booking.id)) {
        if ((p.status === 'pending' || p.status === 'failed') && p.checkout_session_id) {
          const session = await this.retrieveSession(p.checkout_session_id);
          if (session.status === 'open') await this.call(() => this.stripe.checkout.sessions.expire(p.checkout_session_id!));
          if (session.status !== 'complete') await this.payments.update(trx, p.id, { status: 'expired' });
        }
      }
      await this.refundDeposit(trx, booking.id, actorOf(user), note);
    });
    return this.bookings.getDetail(booking.id);
  }

  /**
   * Closes a request's unfinished checkouts before it expires, so nothing can be paid on it
   * afterwards: an open session is expired at the provider and its row marked expired. Answers
   * false, and closes nothing more, when money is on its way (a deposit paid or a bank debit
   * settling, or a session the player has just completed whose webhook has not arrived): such a
   * request must not expire. A deposit that still arrives after expiry is refunded by the webhook.
   */
  async closeUnfinishedCheckouts(trx: Executor, bookingId: string): Promise<boolean> {
    const rows = await this.payments.listForBooking(trx, bookingId);
    if (rows.some((p) => p.status === 'paid' || p.status === 'processing')) return false;
    for (const p of rows) {
      if ((p.status !== 'pending' && p.status !== 'failed') || !p.checkout_session_id) continue;
      const session = await this.retrieveSession(p.checkout_session_id);
      if (session.status === 'complete') return false;
      if (session.status === 'open') await this.call(() => this.stripe.checkout.sessions.expire(p.checkout_session_id!));
      await this.payments.update(trx, p.id, { status: 'expired' });
    }
    return true;
  }

  /** The owner refunds a deposit from the backoffice. */
  async refundByOwner(user: AuthUser, bookingId: string, reason: string) {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, bookingId);
      if (!booking) throw new NotFoundException(`There is no booking ${bookingId}.`);
      // Already "refunded" but the provider failed the refund: this is the owner's retry.
      const retry = booking.state === 'refunded';
      // State first: a refused state change must never leave money refunded behind it.
      if (retry) await this.historyNote(trx, bookingId, actorOf(user), `Refund tried again: ${reason}`);
      else await this.bookings.transition(trx, bookingId, refundableStates, 'refunded', actorOf(user), `Deposit refunded: ${reason}`);
      const refunded = await this.refundDeposit(trx, bookingId, actorOf(user), reason);
      if (!refunded)
        throw new ConflictException(errorResponse('nothing_due', `Booking ${booking.reference} has no paid deposit to refund.`));
    });
    return this.bookings.getDetail(bookingId);
  }

  /**
   * The shop records the balance it took itself (cash, a card terminal, a bank transfer): the
   * whole amount due, once. An open balance checkout is closed first, so the player cannot also
   * pay online; if they just did, nothing is recorded and the shop is told.
   */
  async recordBalance(user: AuthUser, bookingId: string, input: RecordBalanceInput): Promise<BookingDetail> {
    await this.db.transaction().execute(async (trx) => {
      const { booking, money } = await this.lockWithBalanceDue(trx, bookingId, 'a balance is recorded');
      if (money.balanceDue !== formatMoney(input.amount, money.currency)) {
        throw new BadRequestException(
          `The amount must be the whole balance: the balance due on ${booking.reference} is ${moneyOf({ amount: money.balanceDue ?? '0', currency: money.currency })}; record the whole amount, or the owner waives what is left.`,
        );
      }
      for (const p of await this.payments.listForBooking(trx, bookingId, 'balance')) {
        if ((p.status === 'pending' || p.status === 'failed') && p.checkout_session_id) {
          const session = await this.retrieveSession(p.checkout_session_id);
          if (session.status === 'complete') {
            throw new ConflictException(
              `The player has just paid the balance of ${booking.reference} online; reload the booking to see it.`,
            );
          }
          if (session.status === 'open') await this.call(() => this.stripe.checkout.sessions.expire(p.checkout_session_id!));
          await this.payments.update(trx, p.id, { status: 'expired' });
        }
      }
      await this.payments.insert(trx, {
        booking_id: bookingId,
        kind: 'balance',
        amount: money.balanceDue,
        amount_minor: toProviderAmount(money.balanceDue, money.currency),
        currency: money.currency,
        status: 'paid',
        paid_at: new Date(),
        method: input.method,
        recorded_by: user.id,
        note: input.note?.trim() ?? '',
      });
      await this.bookings.insertNote(
        trx,
        booking,
        actorOf(user),
        `Balance of ${money.balanceDue} ${money.currency} received by ${paymentMethodWords[input.method]}, recorded by ${user.name}.`,
      );
    });
    return this.bookings.getDetail(bookingId);
  }

  /** Locks a ready booking that still has a balance to pay; 404, or 409 in words ("… once the build is ready", "Nothing is due"). */
  private async lockWithBalanceDue(trx: Executor, bookingId: string, what: string) {
    const booking = await this.bookings.lock(trx, bookingId);
    if (!booking) throw new NotFoundException(`There is no booking ${bookingId}.`);
    if (booking.state !== 'ready') {
      throw new ConflictException(
        `Booking ${booking.reference} is "${bookingStateLabels[booking.state]}"; ${what} once the build is ready.`,
      );
    }
    const money = await this.bookings.moneyFacts(bookingId, trx);
    if (money.settled) {
      throw new ConflictException(
        errorResponse('nothing_due', `Nothing is due on ${booking.reference}; the balance is already paid or waived.`),
      );
    }
    return { booking, money };
  }

  /** Asks the player again for the balance, by e-mail with the same figures as their page. */
  async requestBalance(user: AuthUser, bookingId: string): Promise<BookingDetail> {
    await this.db.transaction().execute(async (trx) => {
      const { booking, money } = await this.lockWithBalanceDue(trx, bookingId, 'the balance is requested');
      const customer = await this.payments.findCustomer(trx, booking.customer_id);
      // One reminder a minute at most: a double click sends one e-mail.
      const minute = new Date().toISOString().slice(0, 16);
      await this.mail.enqueueBalanceLetter(trx, customer, booking, money, `balance-again:${bookingId}:${minute}`);
      await this.bookings.insertNote(
        trx,
        booking,
        actorOf(user),
        `Balance of ${money.balanceDue} ${money.currency} requested again by e-mail.`,
      );
    });
    return this.bookings.getDetail(bookingId);
  }
}

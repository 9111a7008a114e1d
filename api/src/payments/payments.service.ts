import { randomUUID } from 'node:crypto';
import { BadGatewayException, BadRequestException, ConflictException, Injectable, Logger, NotFoundException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { AuthUser, BookingDetail, BookingState } from '@loomwright/shared';
import { bookingStateLabels, formatMoney, paymentMethodWords, type RecordBalanceInput } from '@loomwright/shared';
import Stripe from 'stripe';
import { actorOf, BookingsService, type BookingActor } from '../bookings/bookings.service';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { MailService } from '../mail/mail.service';
import { toMinorUnits } from './minor-units';
import { PaymentsRepository, type PaymentRow } from './payments.repository';

export type PaymentKind = PaymentRow['kind'];

/** A player may cancel until the shop sets a bench date (the demo shop's deposit policy). */
const cancellableStates: BookingState[] = ['requested', 'deposit_paid'];
const refundableStates: BookingState[] = ['deposit_paid', 'scheduled', 'declined', 'cancelled'];

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
      if (!booking) throw new ConflictException(`There is no booking ${bookingId}.`);
      const kind: PaymentKind | null = booking.state === 'requested' ? 'deposit' : booking.state === 'ready' ? 'balance' : null;
      if (!kind) {
        throw new ConflictException(
          `Booking ${booking.reference} is "${bookingStateLabels[booking.state]}": nothing is due now. The deposit is paid while a build is requested, the balance once it is ready.`,
        );
      }
      const previous = await this.payments.listForBooking(trx, bookingId, kind);
      if (previous.some((p) => p.status === 'paid')) throw new ConflictException(`The ${kind} for ${booking.reference} is already paid.`);
      for (const p of previous.filter((row) => row.status === 'pending' || row.status === 'failed')) {
        const session = await this.retrieveSession(p.checkout_session_id!);
        // An open session (even after a declined card) is the one to finish; a second would risk two charges.
        if (session.status !== 'expired' && session.url) return { url: session.url, paymentId: p.id };
        if (session.status === 'complete' && p.checkout_url) return { url: p.checkout_url, paymentId: p.id };
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
                  unit_amount: toMinorUnits(amount, currency),
                  product_data: { name: `${label}, build ${booking.reference}`, description: detail.summary },
                },
              },
            ],
            metadata,
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
        amount_minor: toMinorUnits(amount, currency),
        currency,
        status: 'pending',
        checkout_session_id: session.id,
        checkout_url: session.url,
      });
      return { url: session.url, paymentId };
    });
  }

  private amountDue(kind: PaymentKind, detail: BookingDetail) {
    if (kind === 'deposit') return { amount: detail.quote.deposit, currency: detail.quote.currency, label: 'Deposit' };
    if (!detail.balanceDue || Number(detail.balanceDue) <= 0) {
      throw new ConflictException(`Booking ${detail.reference} has no balance to pay.`);
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
   * Refunds the booking's paid deposit through the provider (one refund per payment, whatever
   * the retries) and marks it refunded from the provider's answer; the charge.refunded webhook
   * confirms it later. Returns null when there is no paid deposit to refund.
   */
  async refundDeposit(trx: Executor | undefined, bookingId: string, actor: BookingActor, reason: string): Promise<PaymentRow | null> {
    if (!trx) return this.db.transaction().execute((t) => this.refundDeposit(t, bookingId, actor, reason));
    const paid = (await this.payments.listForBooking(trx, bookingId, 'deposit')).find((p) => p.status === 'paid');
    if (!paid) return null;
    const locked = await this.payments.lockById(trx, paid.id);
    if (!locked || locked.status !== 'paid' || !locked.payment_intent_id) return null;
    const refund = await this.call(() =>
      this.stripe.refunds.create(
        {
          payment_intent: locked.payment_intent_id!,
          reason: 'requested_by_customer',
          metadata: { bookingId, paymentId: locked.id, by: actor.label, note: reason.slice(0, 400) },
        },
        { idempotencyKey: `refund:${locked.id}` },
      ),
    );
    const refunded = await this.payments.update(trx, locked.id, {
      refund_id: refund.id,
      ...(refund.status === 'succeeded' ? { status: 'refunded' as const, refunded_at: new Date() } : {}),
    });
    if (refunded.status === 'refunded') await this.mailRefund(trx, refunded);
    return refunded;
  }

  async mailRefund(trx: Executor, payment: PaymentRow) {
    const booking = await this.bookings.getDetail(payment.booking_id, trx);
    await this.mail.enqueue(trx, {
      template: 'deposit-refunded',
      to: booking.customer.email,
      bookingId: booking.id,
      userId: booking.customer.id,
      data: { name: booking.customer.name, reference: booking.reference, amount: payment.amount, currency: payment.currency.trim() },
      dedupeKey: `deposit-refunded:${payment.id}`,
    });
  }

  /** The player withdraws a request before it is scheduled; a paid deposit goes back to them. */
  async cancel(user: AuthUser, bookingId: string, reason: string | undefined) {
    const booking = await this.bookings.findVisible(user, bookingId);
    await this.db.transaction().execute(async (trx) => {
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

  /** The owner refunds a deposit from the backoffice. */
  async refundByOwner(user: AuthUser, bookingId: string, reason: string) {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, bookingId);
      if (!booking) throw new ConflictException(`There is no booking ${bookingId}.`);
      // State first: a refused state change must never leave money refunded behind it.
      await this.bookings.transition(trx, bookingId, refundableStates, 'refunded', actorOf(user), `Deposit refunded: ${reason}`);
      const refunded = await this.refundDeposit(trx, bookingId, actorOf(user), reason);
      if (!refunded) throw new ConflictException(`Booking ${booking.reference} has no paid deposit to refund.`);
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
      const booking = await this.bookings.lock(trx, bookingId);
      if (!booking) throw new NotFoundException(`There is no booking ${bookingId}.`);
      if (booking.state !== 'ready') {
        throw new ConflictException(
          `Booking ${booking.reference} is "${bookingStateLabels[booking.state]}"; a balance is recorded once the build is ready.`,
        );
      }
      const money = await this.bookings.moneyFacts(bookingId, trx);
      if (money.settled) throw new ConflictException(`Nothing is due on ${booking.reference}; the balance is already paid or waived.`);
      if (money.balanceDue !== formatMoney(input.amount, money.currency)) {
        throw new BadRequestException(
          `amount: the balance due on ${booking.reference} is ${money.balanceDue} ${money.currency}; record the whole amount, or the owner waives what is left.`,
        );
      }
      for (const p of await this.payments.listForBooking(trx, bookingId, 'balance')) {
        if ((p.status === 'pending' || p.status === 'failed') && p.checkout_session_id) {
          const session = await this.retrieveSession(p.checkout_session_id);
          if (session.status === 'complete') {
            throw new ConflictException(`The player has just paid the balance of ${booking.reference} online; reload the booking to see it.`);
          }
          if (session.status === 'open') await this.call(() => this.stripe.checkout.sessions.expire(p.checkout_session_id!));
          await this.payments.update(trx, p.id, { status: 'expired' });
        }
      }
      await this.payments.insert(trx, {
        booking_id: bookingId,
        kind: 'balance',
        amount: money.balanceDue,
        amount_minor: toMinorUnits(money.balanceDue, money.currency),
        currency: money.currency,
        status: 'paid',
        paid_at: new Date(),
        method: input.method,
        recorded_by: user.id,
        note: input.note?.trim() ?? '',
      });
      await this.bookings.insertNote(trx, booking, actorOf(user), `Balance of ${money.balanceDue} ${money.currency} received by ${paymentMethodWords[input.method]}, recorded by ${user.name}.`);
    });
    return this.bookings.getDetail(bookingId);
  }

  /** Asks the player again for the balance, by e-mail with the same figures as their page. */
  async requestBalance(user: AuthUser, bookingId: string): Promise<BookingDetail> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, bookingId);
      if (!booking) throw new NotFoundException(`There is no booking ${bookingId}.`);
      if (booking.state !== 'ready') {
        throw new ConflictException(`Booking ${booking.reference} is "${bookingStateLabels[booking.state]}"; the balance is requested once the build is ready.`);
      }
      const money = await this.bookings.moneyFacts(bookingId, trx);
      if (money.settled) throw new ConflictException(`Nothing is due on ${booking.reference}; the balance is already paid or waived.`);
      const customer = await this.payments.findCustomer(trx, booking.customer_id);
      // One reminder a minute at most: a double click sends one e-mail.
      const minute = new Date().toISOString().slice(0, 16);
      await this.mail.enqueue(trx, {
        template: 'balance-requested',
        to: customer.email,
        bookingId,
        userId: customer.id,
        dedupeKey: `balance-again:${bookingId}:${minute}`,
        data: {
          customerName: customer.name,
          reference: booking.reference,
          firmTotal: money.firmTotal,
          extras: money.approvedExtras,
          paidSoFar: money.netPaid,
          balanceDue: money.balanceDue,
          currency: money.currency,
        },
      });
      await this.bookings.insertNote(trx, booking, actorOf(user), `Balance of ${money.balanceDue} ${money.currency} requested again by e-mail.`);
    });
    return this.bookings.getDetail(bookingId);
  }
}

import { BadRequestException, ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import {
  dateShiftWords,
  type AuthUser,
  type BookingDetail,
  type BookingState,
  type CancelScheduledInput,
  type CancellationPreview,
  type RescheduleInput,
  type RescheduleResponse,
} from '@loomwright/shared';
import { AWAITING_PEDALS } from '../bench/bench.service';
import { shipByDate } from '../bench/scheduling';
import { actorOf } from '../bookings/bookings.service';
import { type Executor } from '../database/database';
import { BuildServiceBase, planDays } from './build-service.base';
import { assertLevelRule } from './builds.service';
import { inBenchTransaction } from './bench-transaction';
import { whatToShip } from './what-to-ship';

/** PostgreSQL SQLSTATEs the bench constraints raise (PostgreSQL docs, Appendix A "Error Codes"). */

/** A build can change its bench date or builder until work starts on it. */
const MOVABLE: BookingState[] = ['scheduled', 'pedals_received'];
/** The owner can cancel a build that holds bench time, up to the bench itself. */
const CANCELLABLE: BookingState[] = ['scheduled', 'pedals_received', 'on_bench'];

/**
 * The deposit policy after acceptance (the demo shop's, stated before payment): the deposit holds
 * the bench date, so once it is set a player's own cancellation keeps it, unless the shop raised
 * the price above the range the player was quoted and they have not agreed; a cancellation the
 * shop makes (it cannot build it) refunds it in full (common practice, no published source).
 */
export const AFTER_ACCEPTANCE_POLICY =
  'Once a bench date is set the deposit holds it: if the player cancels, the shop keeps the deposit, unless the firm price went above the quoted range and the player has not agreed to it; if the shop cancels, the whole deposit is refunded.';

@Injectable()
export class BenchChangesService extends BuildServiceBase {
  async reschedule(user: AuthUser, bookingId: string, input: RescheduleInput): Promise<RescheduleResponse> {
    return inBenchTransaction(this.db, (trx) => this.rescheduleIn(trx, user, bookingId, input));
  }

  /**
   * One transaction: lock the booking, then the new builder (the same order as an acceptance, so
   * the two never deadlock), release the build's own slices, plan it again on the bench as it is
   * now and write the new slices under the same exclusion constraint.
   */
  private async rescheduleIn(trx: Executor, user: AuthUser, bookingId: string, input: RescheduleInput): Promise<RescheduleResponse> {
    const booking = await this.lockInState(
      trx,
      bookingId,
      MOVABLE,
      'a build can be moved while it is scheduled or its pedals are in, before it goes on the bench.',
    );
    if (input.reprice && user.role !== 'owner')
      throw new ForbiddenException('Only the owner can re-price a firm quote at another builder’s rate.');
    const { facts, builder } = await this.factsAndBuilder(trx, bookingId, input.builderId);
    const reassigned = builder.id !== booking.builder_id;
    const belowLevel = reassigned ? assertLevelRule(user, builder, facts, input.levelOverrideReason) : false;
    if (!reassigned && input.levelOverrideReason) {
      throw new BadRequestException(
        'A reason for a builder below the level is only for handing the build to a builder below the level the player chose.',
      );
    }
    if (input.reprice && !reassigned)
      throw new BadRequestException('Re-pricing is only for a move to another builder; the firm quote already uses this builder’s rate.');

    const { shop, plan } = await this.planOnBench(trx, booking, builder, facts.laborHours, input.benchDate, true);
    const previousDate = booking.bench_date;
    const { voice, formatDay } = await this.shopVoice(trx);
    if (!reassigned && previousDate === input.benchDate) {
      throw new BadRequestException(
        `The build already starts on ${formatDay(input.benchDate)} with this builder; pick another day or builder.`,
      );
    }
    await this.bench.releaseAllocations(trx, bookingId);
    await this.bench.allocate(trx, bookingId, builder, shop, plan);

    // The firm quote: kept as it is unless the owner re-prices at the new builder's rate.
    const current = await this.bookingRows.latestQuote(trx, bookingId, 'firm');
    if (!current?.total) throw new ConflictException(`Booking ${booking.reference} has no firm quote; accept it before moving it.`);
    let firmTotal = current.total;
    let priceConsent = booking.price_consent;
    if (input.reprice) {
      const { figures } = await this.insertFirmQuote(trx, bookingId, current, facts, builder, current.deposit, plan);
      firmTotal = figures.total;
      // Above what the player was quoted: their yes is needed again before the deposit is kept.
      priceConsent = new Decimal(figures.total).gt(facts.quotedHigh) ? 'pending' : priceConsent === 'pending' ? null : priceConsent;
    }

    const sequence = booking.calendar_sequence + 1;
    const shift = previousDate ? dateShiftWords(previousDate, plan.benchDate) : 'a new date';
    const who = reassigned ? `${builder.name} (${builder.level}) instead of the previous builder` : builder.name;
    const priceNote = input.reprice
      ? ` Re-priced at ${builder.name}'s rate: firm total ${voice.money(firmTotal, facts.currency)} (was ${voice.money(current.total, facts.currency)}).`
      : '';
    const levelNote = belowLevel ? ` Level override: ${input.levelOverrideReason!.trim()}` : '';
    await this.history.note(
      trx,
      booking,
      user,
      `Moved to ${formatDay(plan.benchDate)}${previousDate ? ` from ${formatDay(previousDate)} (${shift})` : ''} with ${who}; expected completion ${formatDay(plan.expectedCompletion)}. Why: ${input.reason}${priceNote}${levelNote}`,
      // The player is mailed the same reason, price and level words, so the timeline shows them too.
      'player',
    );
    await this.bookingRows.updateIfIn(trx, bookingId, MOVABLE, {
      builder_id: builder.id,
      bench_date: plan.benchDate,
      expected_completion: plan.expectedCompletion,
      calendar_sequence: sequence,
      price_consent: priceConsent,
      ...(belowLevel ? { level_override_reason: input.levelOverrideReason!.trim() } : reassigned ? { level_override_reason: null } : {}),
    });

    const awaitingPedals = AWAITING_PEDALS.includes(booking.state);
    const shipBy = awaitingPedals ? shipByDate(plan.benchDate, shop) : null;
    // The money facts after the move (and any new firm quote): the one place a balance is worked out.
    const money = await this.bookings.moneyFacts(bookingId, trx);
    await this.mail.enqueue(trx, {
      template: 'booking-rescheduled',
      to: booking.customer_email,
      bookingId,
      userId: booking.customer_id,
      dedupeKey: `rescheduled:${bookingId}:${sequence}`,
      data: {
        name: booking.customer_name,
        reference: booking.reference,
        benchDate: plan.benchDate,
        previousBenchDate: previousDate ?? plan.benchDate,
        shift,
        reason: input.reason,
        shipBy: shipBy ?? plan.benchDate,
        pedalsReceived: !awaitingPedals,
        expectedCompletion: plan.expectedCompletion,
        builderLevel: builder.level,
        builderName: builder.name,
        firmTotal,
        deposit: money.netPaid,
        balanceDue: money.balanceDue ?? firmTotal,
        currency: facts.currency,
        quotedHigh: facts.quotedHigh,
        priceConsentNeeded: input.reprice === true && priceConsent === 'pending',
        levelOverrideReason: belowLevel ? input.levelOverrideReason!.trim() : undefined,
        whatToShip: whatToShip(booking.configuration),
        calendarSequence: sequence,
      },
    });
    return {
      bookingId,
      builderId: builder.id,
      benchDate: plan.benchDate,
      previousBenchDate: previousDate,
      expectedCompletion: plan.expectedCompletion,
      shipBy,
      plan: planDays(plan),
      shift,
      firmTotal,
      repriced: input.reprice === true,
      priceConsent,
      calendarSequence: sequence,
    };
  }

  /** What cancelling would refund, for each cause, before the owner confirms. */
  async cancellationPreview(bookingId: string): Promise<CancellationPreview> {
    const booking = await this.bookingRows.findById(bookingId);
    if (!booking) throw new NotFoundException('There is no booking with that id.');
    const deposit = (await this.bookingRows.paymentsFor(bookingId, this.db)).find((p) => p.kind === 'deposit' && p.status === 'paid');
    const paid = new Decimal(deposit?.amount ?? 0);
    return {
      bookingId,
      reference: booking.reference,
      state: booking.state,
      currency: (deposit?.currency ?? 'USD').trim(),
      depositPaid: paid.toFixed(2),
      refundIfPlayerAsked: this.refundFor('player', booking.price_consent, paid).toFixed(2),
      refundIfShopCancels: this.refundFor('shop', booking.price_consent, paid).toFixed(2),
      policy: AFTER_ACCEPTANCE_POLICY,
      benchHours: await this.bench.hoursHeld(this.db, bookingId),
    };
  }

  private refundFor(cause: CancelScheduledInput['cause'], consent: 'pending' | 'given' | null, paid: Decimal): Decimal {
    if (cause === 'shop' || consent === 'pending') return paid;
    return new Decimal(0);
  }

  /** The owner cancels a build that already holds bench time. */
  async cancelScheduled(user: AuthUser, bookingId: string, input: CancelScheduledInput): Promise<BookingDetail> {
    await this.db.transaction().execute((trx) => this.cancelIn(trx, user, bookingId, input.reason, input.cause, CANCELLABLE));
    return this.bookings.getDetail(bookingId);
  }

  /**
   * State first, bench time and refund next, mail last, one transaction: a refused cancellation
   * never leaves money refunded or hours released behind it, and a retried one finds the booking
   * cancelled (409) instead of refunding twice (the provider call also carries an idempotency key).
   */
  private async cancelIn(
    trx: Executor,
    user: AuthUser,
    bookingId: string,
    reason: string,
    cause: CancelScheduledInput['cause'],
    allowed: BookingState[],
  ) {
    const booking = await this.lockInState(
      trx,
      bookingId,
      allowed,
      'this cancels a build that has a bench date, before it reaches testing.',
      'too_late_to_cancel',
    );
    const hours = await this.bench.hoursHeld(trx, bookingId);
    const shop = await this.bench.shopCalendar(trx);
    const awaitingPedals = AWAITING_PEDALS.includes(booking.state);
    const deposit = (await this.bookingRows.paymentsFor(bookingId, trx)).find((p) => p.kind === 'deposit' && p.status === 'paid');
    const paid = new Decimal(deposit?.amount ?? 0);
    const refundDue = this.refundFor(cause, booking.price_consent, paid);
    const kept = paid.minus(refundDue);
    const byWhom = cause === 'shop' ? 'the shop' : 'the player';
    await this.history.move(
      trx,
      booking,
      allowed,
      'cancelled',
      user,
      `Cancelled (asked by ${byWhom}): ${reason}. Released ${hours} h of bench time.${refundDue.gt(0) ? ` Deposit of ${refundDue.toFixed(2)} refunded.` : kept.gt(0) ? ` Deposit of ${kept.toFixed(2)} kept per the deposit policy.` : ''}`,
      { cancel_reason: reason, calendar_sequence: booking.calendar_sequence + 1, price_consent: null },
    );
    await this.bench.releaseAllocations(trx, bookingId);
    if (refundDue.gt(0)) {
      const refunded = await this.payments.refundDeposit(trx, bookingId, actorOf(user), `Cancelled: ${reason}`);
      if (!refunded) {
        throw new ConflictException(
          `The deposit of ${booking.reference} has no provider payment to refund automatically; refund it with the payment provider first, then cancel.`,
        );
      }
    }
    await this.mail.enqueue(trx, {
      template: 'booking-cancelled',
      to: booking.customer_email,
      bookingId,
      userId: booking.customer_id,
      dedupeKey: `cancelled:${bookingId}`,
      data: {
        name: booking.customer_name,
        reference: booking.reference,
        reason,
        currency: (deposit?.currency ?? shop.currency).trim(),
        refundAmount: refundDue.gt(0) ? refundDue.toFixed(2) : null,
        keptAmount: kept.gt(0) ? kept.toFixed(2) : null,
        shipBy: awaitingPedals && booking.bench_date ? shipByDate(booking.bench_date, shop) : null,
        calendarSequence: booking.calendar_sequence + 1,
        pedalsAtShop: !awaitingPedals,
      },
    });
  }

  /**
   * The player answers a firm price above the range they were quoted: yes keeps the build and the
   * deposit; no cancels it with the whole deposit back.
   */
  async decidePrice(user: AuthUser, bookingId: string, accept: boolean): Promise<BookingDetail> {
    const visible = await this.bookings.findVisible(user, bookingId);
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.bookingRows.lockWithCustomer(trx, visible.id);
      if (!booking || booking.price_consent !== 'pending') {
        throw new ConflictException(`Booking ${visible.reference} is not waiting for your answer on its price.`);
      }
      if (accept) {
        await this.bookingRows.updateIfIn(trx, booking.id, [booking.state], { price_consent: 'given' });
        const firm = await this.bookingRows.latestQuote(trx, booking.id, 'firm');
        await this.history.note(
          trx,
          booking,
          user,
          `The player agreed to the firm total of ${firm?.total ?? '?'} ${firm?.currency.trim() ?? ''}.`.replace(/ \.$/, '.'),
          'player',
        );
        return;
      }
      await this.cancelIn(
        trx,
        user,
        booking.id,
        'the firm price above the estimate was not agreed, so the whole deposit is refunded',
        'player',
        CANCELLABLE,
      );
    });
    return this.bookings.getDetail(visible.id);
  }
}

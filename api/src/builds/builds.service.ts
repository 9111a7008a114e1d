import { BadRequestException, ConflictException, ForbiddenException, Injectable } from '@nestjs/common';
import Decimal from 'decimal.js';
import {
  benchTransitions,
  levelRank,
  type AcceptBookingInput,
  type AcceptBookingResponse,
  type AuthUser,
  type BenchState,
  type BookingDetail,
  type BookingState,
  type BookingStateResponse,
  type BuilderLevel,
} from '@loomwright/shared';
import { shipByDate } from '../bench/scheduling';
import { type Executor } from '../database/database';
import { actorOf } from '../bookings/bookings.service';
import { formatMoney as formatMoneyWords } from '../mail/templates/format';
import { dayWords } from '../common/shop-voice';
import { deliveryHold } from '../bookings/booking-view';
import { BuildServiceBase, planDays } from './build-service.base';
import { stateWords } from './build-history';
import { inBenchTransaction } from './bench-transaction';
import { whatToShip } from './what-to-ship';

/** PostgreSQL SQLSTATEs the bench constraints raise (PostgreSQL docs, Appendix A "Error Codes"). */

/**
 * Builders below the level the player chose (raised to the rig's minimum) take a build only from
 * the owner, with a reason the player reads beside the price. Returns whether this is such a case.
 */
export function assertLevelRule(
  user: AuthUser,
  builder: { name: string; level: BuilderLevel },
  facts: { minimumLevel: BuilderLevel; chosenLevel: BuilderLevel },
  reason: string | undefined,
): boolean {
  const below = levelRank(builder.level) < levelRank(facts.chosenLevel);
  const why =
    levelRank(builder.level) < levelRank(facts.minimumLevel)
      ? `this rig needs at least a ${facts.minimumLevel} builder and ${builder.name} is ${builder.level}`
      : `the player chose a ${facts.chosenLevel} builder and ${builder.name} is ${builder.level}`;
  if (below) {
    if (user.role !== 'owner') {
      throw new ForbiddenException(`${why[0].toUpperCase()}${why.slice(1)}; only the owner can assign them, with a reason.`);
    }
    if (!reason?.trim()) throw new BadRequestException(`A reason for a builder below the level is required: ${why}.`);
  } else if (reason) {
    throw new BadRequestException(
      `A reason for a builder below the level is only for a builder below the level the player chose; ${builder.name} meets it.`,
    );
  }
  return below;
}

/** Once a build reaches these, its bench time after today is released (it finished early, or on time). */
const RELEASING_STATES: BenchState[] = ['testing', 'ready', 'delivered'];

/** The state moves that tell the player something by e-mail. */
const MAILED_STATES: BenchState[] = ['pedals_received', 'ready', 'delivered'];

@Injectable()
export class BuildsService extends BuildServiceBase {
  async accept(user: AuthUser, bookingId: string, dto: AcceptBookingInput): Promise<AcceptBookingResponse> {
    return inBenchTransaction(this.db, (trx) => this.acceptIn(trx, user, bookingId, dto));
  }

  private async acceptIn(trx: Executor, user: AuthUser, bookingId: string, dto: AcceptBookingInput): Promise<AcceptBookingResponse> {
    // Lock order is always booking, then builder, so concurrent acceptances cannot deadlock.
    const booking = await this.lockInState(
      trx,
      bookingId,
      ['deposit_paid'],
      'a build can be accepted only once its deposit is paid and before it is scheduled.',
    );
    const { facts, builder } = await this.factsAndBuilder(trx, bookingId, dto.builderId);
    const belowLevel = assertLevelRule(user, builder, facts, dto.levelOverrideReason);
    const { shop, plan } = await this.planOnBench(trx, booking, builder, facts.laborHours, dto.benchDate);
    await this.bench.allocate(trx, bookingId, builder, shop, plan);

    const payments = await this.bookingRows.paymentsFor(bookingId, trx);
    const depositPaid = payments.find((p) => p.kind === 'deposit' && p.status === 'paid')?.amount ?? facts.deposit;
    const firm = await this.insertFirmQuote(trx, bookingId, facts.estimateQuote, facts, builder, depositPaid, plan);
    const { figures } = firm;
    const aboveQuoted = new Decimal(figures.total).gt(facts.quotedHigh);

    // The balance from the money facts with the new firm quote in place: the one place a balance is worked out.
    const { balanceDue } = await this.bookings.moneyFacts(bookingId, trx);
    const shipBy = shipByDate(plan.benchDate, shop);
    const { formatDay } = await this.shopVoice(trx);
    const levelNote = belowLevel ? ` Level override: ${dto.levelOverrideReason!.trim()}` : '';
    await this.history.move(
      trx,
      booking,
      ['deposit_paid'],
      'scheduled',
      user,
      `Accepted for ${builder.name} (${builder.level}); bench date ${formatDay(plan.benchDate)}, expected completion ${formatDay(plan.expectedCompletion)}.${levelNote}`,
      {
        builder_id: builder.id,
        bench_date: plan.benchDate,
        expected_completion: plan.expectedCompletion,
        level_override_reason: belowLevel ? dto.levelOverrideReason!.trim() : null,
        price_consent: aboveQuoted ? 'pending' : null,
      },
    );
    await this.mail.enqueue(trx, {
      template: 'booking-scheduled',
      to: booking.customer_email,
      bookingId,
      userId: booking.customer_id,
      dedupeKey: `scheduled:${bookingId}:${plan.benchDate}`,
      data: {
        name: booking.customer_name,
        reference: booking.reference,
        benchDate: plan.benchDate,
        shipBy,
        expectedCompletion: plan.expectedCompletion,
        builderLevel: builder.level,
        builderName: builder.name,
        firmTotal: figures.total,
        deposit: depositPaid,
        balanceDue: balanceDue ?? figures.balanceDue,
        currency: facts.currency,
        whatToShip: whatToShip(booking.configuration),
        quotedHigh: facts.quotedHigh,
        priceConsentNeeded: aboveQuoted,
        levelOverrideReason: belowLevel ? dto.levelOverrideReason!.trim() : undefined,
        calendarSequence: 0,
      },
    });
    return {
      bookingId,
      state: 'scheduled',
      builderId: builder.id,
      benchDate: plan.benchDate,
      expectedCompletion: plan.expectedCompletion,
      shipBy,
      plan: planDays(plan),
      firmQuote: {
        id: firm.id,
        hourlyRate: builder.hourly_rate,
        laborHours: facts.laborHours,
        laborTotal: figures.laborTotal,
        materialsTotal: new Decimal(facts.materialsTotal).toFixed(2),
        total: figures.total,
        deposit: depositPaid,
        balanceDue: balanceDue ?? figures.balanceDue,
        currency: facts.currency,
      },
    };
  }

  async decline(user: AuthUser, bookingId: string, reason: string): Promise<BookingDetail> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockInState(trx, bookingId, ['requested', 'deposit_paid'], 'only a request can be declined.');
      const paid = booking.state === 'deposit_paid';
      if (paid && user.role !== 'owner') {
        throw new ForbiddenException('Only the owner can decline a paid request, because it refunds the deposit.');
      }
      await this.history.move(trx, booking, ['requested', 'deposit_paid'], 'declined', user, `Declined: ${reason.trim()}`, {
        decline_reason: reason.trim(),
      });
      // State first, refund second, one transaction: a refused decline never leaves money refunded behind it.
      const deposit = (await this.bookingRows.paymentsFor(bookingId, trx)).find((p) => p.kind === 'deposit' && p.status === 'paid');
      const refunded =
        paid && deposit ? await this.payments.refundDeposit(trx, bookingId, actorOf(user), `Declined: ${reason.trim()}`) : null;
      if (deposit && !refunded) {
        throw new ConflictException(
          `The deposit of ${booking.reference} has no provider payment to refund automatically; refund it with the payment provider first, then decline.`,
        );
      }
      await this.mail.enqueue(trx, {
        template: 'booking-declined',
        to: booking.customer_email,
        bookingId,
        userId: booking.customer_id,
        dedupeKey: `declined:${bookingId}`,
        data: {
          name: booking.customer_name,
          reference: booking.reference,
          reason: reason.trim(),
          depositRefunded: !!refunded,
          refundAmount: refunded?.amount ?? null,
          refundPending: refunded ? refunded.status !== 'refunded' : false,
          currency: refunded?.currency.trim() ?? null,
        },
      });
    });
    return this.bookings.getDetail(bookingId);
  }

  /**
   * Moves a build on. A note stays internal unless `tellPlayer`: the player's timeline then shows
   * it and the status e-mail carries it word for word; otherwise they see only the move itself.
   */
  async changeState(user: AuthUser, bookingId: string, to: BenchState, note = '', tellPlayer = false): Promise<BookingStateResponse> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.lockBooking(trx, bookingId);
      const from = booking.state as BenchState;
      const allowed = benchTransitions[from as BenchState];
      if (!allowed || !allowed.includes(to)) {
        const next = allowed?.length ? `; from there it can move to ${allowed.map(stateWords).join(' or ')}` : '';
        throw new ConflictException(`Booking ${booking.reference} is ${stateWords(from)} and cannot move to ${stateWords(to)}${next}.`);
      }
      if (to === 'pedals_received' && (await this.builds.intakeItems(trx, bookingId)).length === 0) {
        throw new ConflictException(
          'Record the intake first (each pedal and the supply as working or faulty), then mark the pedals received.',
        );
      }
      if (to === 'testing' && booking.awaiting_layout_approval) {
        throw new ConflictException(`Booking ${booking.reference} is waiting for the player's layout approval; testing starts after it.`);
      }
      const money = await this.bookings.moneyFacts(bookingId, trx);
      if (to === 'delivered' && !money.settled) {
        throw new ConflictException(
          `${booking.reference} still has a balance of ${formatMoneyWords(money.balanceDue ?? '0', money.currency)} to pay; ` +
            'request or record the balance first, or the owner can waive it with a reason. Then mark it delivered.',
        );
      }
      if (to === 'ready') {
        const waiting = (await this.bookings.getDetail(bookingId, trx)).extras.filter((x) => x.status === 'proposed');
        if (waiting.length) {
          throw new ConflictException(
            `${waiting.map((x) => x.description).join(', ')} still ${waiting.length === 1 ? 'waits' : 'wait'} for the player's answer; ` +
              'record their answer (given by phone or in person) before asking for the balance.',
          );
        }
      }
      if (to === 'delivered') {
        // A disputed payment holds delivery until the owner decides (POST /api/bookings/:id/dispute/release).
        const hold = deliveryHold(await this.bookingRows.paymentsFor(bookingId, trx));
        if (hold) throw new ConflictException(`Booking ${booking.reference} cannot be delivered yet. ${hold}`);
      }
      const words = note.trim();
      const told = tellPlayer && words !== '';
      const updated = await this.history.move(trx, booking, [from], to, user, told ? words : `Moved to ${stateWords(to)}.`);
      if (words && !told) await this.history.note(trx, { id: bookingId, state: to }, user, words);
      if (RELEASING_STATES.includes(to)) {
        // The bench work is done: hours booked after today go back to the builder's free time.
        const { today } = await this.bench.shopCalendar(trx);
        const freed = await this.bench.releaseAfter(trx, bookingId, today);
        if (freed > 0) {
          const { voice } = await this.shopVoice(trx);
          await this.history.note(
            trx,
            updated,
            user,
            `Released ${voice.hours(freed)} of bench time booked after ${dayWords(voice, today)}: the build reached ${stateWords(to)}.`,
          );
        }
      }
      if (to === 'ready') {
        const player = { id: booking.customer_id, name: booking.customer_name, email: booking.customer_email };
        await this.mail.enqueueBalanceLetter(trx, player, booking, money, `balance:${bookingId}`);
      }
      if (MAILED_STATES.includes(to)) {
        const faulty =
          to === 'pedals_received' ? (await this.builds.intakeItems(trx, bookingId)).filter((i) => i.condition === 'faulty') : [];
        await this.mail.enqueue(trx, {
          template: 'status-changed',
          to: booking.customer_email,
          bookingId,
          userId: booking.customer_id,
          dedupeKey: `status:${bookingId}:${to}`,
          data: {
            name: booking.customer_name,
            reference: booking.reference,
            fromState: from,
            state: to,
            note: told ? words : '',
            faultyItems: faulty.map((i) => ({ item: i.item, note: i.note })),
          },
        });
      }
      return { bookingId, state: updated.state, awaitingLayoutApproval: updated.awaiting_layout_approval };
    });
  }

  async waiveBalance(user: AuthUser, bookingId: string, reason: string): Promise<BookingStateResponse> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.lockInState(trx, bookingId, ['ready'], 'a balance can be waived once the build is ready.');
      if (booking.balance_waived_reason) throw new ConflictException(`The balance of ${booking.reference} is already waived.`);
      await this.bookingRows.updateIfIn(trx, bookingId, ['ready'], { balance_waived_reason: reason.trim() });
      await this.history.note(trx, booking, user, `Balance waived: ${reason.trim()}`);
      return { bookingId, state: booking.state, awaitingLayoutApproval: booking.awaiting_layout_approval };
    });
  }

  /** Bench states in which the shop is working on a build (for records that only make sense then). */
  static readonly workingStates: BookingState[] = ['pedals_received', 'on_bench', 'testing', 'ready'];
}

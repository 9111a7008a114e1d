import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import Decimal from 'decimal.js';
import {
  decidedViaWords,
  type AuthUser,
  type BookingState,
  type BookingStateResponse,
  type ExtraView,
  type LayoutRequestInput,
  type PlayerDecisionInput,
  type ProposeExtraInput,
  type RecordedDecisionInput,
} from '@loomwright/shared';
import { type Executor } from '../database/database';
import { BuildServiceBase } from './build-service.base';
import { stateWords } from './build-history';
import { type Decision } from './builds.repository';
import { BookingsRepository } from '../bookings/bookings.repository';

/** While these last, the shop may propose an extra and the player (or staff for them) may answer. */
const extraStates: BookingState[] = ['scheduled', 'pedals_received', 'on_bench', 'testing'];

type LockedBooking = NonNullable<Awaited<ReturnType<BookingsRepository['lockWithCustomer']>>>;

/**
 * The player's yes or no to what the shop asks: extras with a price, and the top-view layout
 * before cables are cut. The player answers in the app (from the e-mail's link); staff record an
 * answer the player gave by phone, in person or by e-mail, with who gave it and how.
 */
@Injectable()
export class ApprovalsService extends BuildServiceBase {
  /** Only the booking's own player answers in the app; another player's booking is simply not there for them. */
  private static playerOnly(user: AuthUser, booking: LockedBooking) {
    if (booking.customer_id !== user.id) throw new NotFoundException('There is no booking with that id in your account.');
  }

  private static decisionWords(decision: Decision, by: AuthUser) {
    const how = decidedViaWords[decision.via];
    const recorded = decision.recordedBy ? `, recorded by ${by.name}` : '';
    const comment = decision.comment ? ` Comment: ${decision.comment}` : '';
    return { how, recorded, comment };
  }

  // ---- extras ----

  async proposeExtra(user: AuthUser, bookingId: string, dto: ProposeExtraInput): Promise<ExtraView> {
    const id = await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockBooking(trx, bookingId);
      if (!extraStates.includes(booking.state)) {
        throw new ConflictException(
          `Booking ${booking.reference} is ${stateWords(booking.state)}; extras can be proposed only while it is ${extraStates.map(stateWords).join(', ')}.`,
        );
      }
      const amount = new Decimal(dto.amount).toFixed(2);
      const row = await this.builds.insertExtra(trx, {
        bookingId,
        description: dto.description,
        amount,
        reason: dto.reason,
        proposedBy: user.id,
      });
      const firm = await this.bookingRows.latestQuote(trx, bookingId, 'firm');
      const currency = firm?.currency.trim() ?? 'USD';
      await this.history.note(
        trx,
        booking,
        user,
        `Extra proposed for the player's approval: ${dto.description}, ${amount} ${currency} (${dto.reason}).`,
        'player',
      );
      await this.mail.enqueue(trx, {
        template: 'approval-requested',
        to: booking.customer_email,
        bookingId,
        userId: booking.customer_id,
        dedupeKey: `approval:extra:${row.id}`,
        data: {
          name: booking.customer_name,
          reference: booking.reference,
          kind: 'extra',
          description: dto.description,
          amount,
          currency,
          reason: dto.reason,
        },
      });
      return row.id;
    });
    return this.extra(bookingId, id);
  }

  /** The player answers in the app. */
  async decideExtra(user: AuthUser, bookingId: string, extraId: string, input: PlayerDecisionInput): Promise<ExtraView> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockBooking(trx, bookingId);
      ApprovalsService.playerOnly(user, booking);
      await this.applyExtraDecision(trx, booking, extraId, user, {
        approve: input.approve,
        via: 'app',
        givenBy: user.name,
        comment: input.comment ?? '',
        recordedBy: null,
      });
    });
    return this.extra(bookingId, extraId);
  }

  /** Staff record the player's answer given by phone, in person or by e-mail. */
  async recordExtraDecision(user: AuthUser, bookingId: string, extraId: string, input: RecordedDecisionInput): Promise<ExtraView> {
    await this.db.transaction().execute(async (trx) => {
      const booking = await this.lockBooking(trx, bookingId);
      await this.applyExtraDecision(trx, booking, extraId, user, {
        approve: input.approve,
        via: input.via,
        givenBy: input.givenBy,
        comment: input.comment ?? '',
        recordedBy: user.id,
      });
    });
    return this.extra(bookingId, extraId);
  }

  private async applyExtraDecision(trx: Executor, booking: LockedBooking, extraId: string, by: AuthUser, decision: Decision) {
    const extra = await this.builds.lockExtra(trx, booking.id, extraId);
    if (!extra) throw new NotFoundException('There is no such extra on this booking.');
    if (extra.status !== 'proposed')
      throw new ConflictException(`This extra is already ${extra.status}; an answer cannot be changed once given.`);
    if (!extraStates.includes(booking.state)) {
      throw new ConflictException(`Booking ${booking.reference} is ${stateWords(booking.state)}; its extras can no longer change.`);
    }
    await this.builds.decideExtra(trx, extraId, decision);
    const { how, recorded, comment } = ApprovalsService.decisionWords(decision, by);
    await this.history.note(
      trx,
      booking,
      by,
      `Extra ${decision.approve ? 'approved' : 'declined'} by ${decision.givenBy} (${how}${recorded}): ${extra.description}, ${extra.amount}.${comment}`,
      'player',
    );
  }

  async extras(user: AuthUser, bookingId: string): Promise<ExtraView[]> {
    await this.bookings.findVisible(user, bookingId);
    return (await this.bookings.getDetail(bookingId)).extras;
  }

  private async extra(bookingId: string, extraId: string): Promise<ExtraView> {
    const found = (await this.bookings.getDetail(bookingId)).extras.find((x) => x.id === extraId);
    if (!found) throw new NotFoundException('There is no such extra on this booking.');
    return found;
  }

  // ---- layout ----

  async requestLayoutApproval(user: AuthUser, bookingId: string, input: LayoutRequestInput): Promise<BookingStateResponse> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.lockBooking(trx, bookingId);
      if (booking.state !== 'on_bench') {
        throw new ConflictException(
          `Booking ${booking.reference} is ${stateWords(booking.state)}; a layout can be sent for approval only while it is on bench.`,
        );
      }
      if (booking.awaiting_layout_approval || (await this.builds.lockWaitingLayout(trx, bookingId))) {
        throw new ConflictException('The layout is already waiting for the player’s approval.');
      }
      const message = (input.message ?? input.note ?? '').trim();
      await this.builds.insertLayoutApproval(trx, { bookingId, requestedBy: user.id, message });
      const updated = await this.bookingRows.updateIfIn(trx, bookingId, ['on_bench'], { awaiting_layout_approval: true });
      await this.history.note(trx, booking, user, `Layout sent to the player for approval${message ? `: ${message}` : '.'}`, 'player');
      await this.mail.enqueue(trx, {
        template: 'approval-requested',
        to: booking.customer_email,
        bookingId,
        userId: booking.customer_id,
        data: { name: booking.customer_name, reference: booking.reference, kind: 'layout', ...(message ? { message } : {}) },
      });
      return { bookingId, state: updated!.state, awaitingLayoutApproval: true };
    });
  }

  async decideLayout(user: AuthUser, bookingId: string, input: PlayerDecisionInput): Promise<BookingStateResponse> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.lockBooking(trx, bookingId);
      ApprovalsService.playerOnly(user, booking);
      return this.applyLayoutDecision(trx, booking, user, {
        approve: input.approve,
        via: 'app',
        givenBy: user.name,
        comment: input.comment ?? '',
        recordedBy: null,
      });
    });
  }

  async recordLayoutDecision(user: AuthUser, bookingId: string, input: RecordedDecisionInput): Promise<BookingStateResponse> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.lockBooking(trx, bookingId);
      return this.applyLayoutDecision(trx, booking, user, {
        approve: input.approve,
        via: input.via,
        givenBy: input.givenBy,
        comment: input.comment ?? '',
        recordedBy: user.id,
      });
    });
  }

  private async applyLayoutDecision(
    trx: Executor,
    booking: LockedBooking,
    by: AuthUser,
    decision: Decision,
  ): Promise<BookingStateResponse> {
    const waiting = await this.builds.lockWaitingLayout(trx, booking.id);
    if (!waiting || !booking.awaiting_layout_approval) throw new ConflictException('There is no layout waiting for an answer.');
    await this.builds.decideLayout(trx, waiting.id, decision);
    const updated = await this.bookingRows.updateIfIn(trx, booking.id, [booking.state], { awaiting_layout_approval: false });
    const { how, recorded, comment } = ApprovalsService.decisionWords(decision, by);
    await this.history.note(
      trx,
      booking,
      by,
      `Layout ${decision.approve ? 'approved' : 'declined'} by ${decision.givenBy} (${how}${recorded}).${comment}${decision.approve ? '' : ' The builder sends a changed layout.'}`,
      'player',
    );
    return { bookingId: booking.id, state: updated!.state, awaitingLayoutApproval: false };
  }
}

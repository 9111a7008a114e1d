import { ConflictException, Injectable } from '@nestjs/common';
import type { Updateable } from 'kysely';
import type { AuthUser, BookingState } from '@loomwright/shared';
import type { BookingsTable, Executor } from '../database/database';
import { BuildsRepository } from './builds.repository';

export const stateWords = (state: string) => state.replace(/_/g, ' ');

/** "Teodor Lind (builder)": who did it, as the history shows it to staff and the player. */
export const actorLabel = (user: AuthUser) => `${user.name} (${user.role === 'customer' ? 'player' : user.role})`;

/**
 * Every change to a build goes through here so it lands in booking_events with who and when,
 * in the same transaction as the change itself.
 */
@Injectable()
export class BuildHistory {
  constructor(private readonly builds: BuildsRepository) {}

  async move(
    trx: Executor,
    booking: { id: string; reference: string; state: BookingState },
    allowedFrom: BookingState[],
    to: BookingState,
    actor: AuthUser,
    note: string,
    values: Updateable<BookingsTable> = {},
  ) {
    if (!allowedFrom.includes(booking.state)) {
      throw new ConflictException(
        `Booking ${booking.reference} is ${stateWords(booking.state)}; it cannot move to ${stateWords(to)} from there.`,
      );
    }
    const updated = await this.builds.updateBooking(trx, booking.id, allowedFrom, { ...values, state: to });
    if (!updated) throw new ConflictException(`Booking ${booking.reference} changed meanwhile; reload it and try again.`);
    await this.builds.insertEvent(trx, { bookingId: booking.id, from: booking.state, to, actorId: actor.id, actorLabel: actorLabel(actor), note });
    return updated;
  }

  /** A change that keeps the state (hours, intake, extras, layout): still one line of history. */
  note(trx: Executor, booking: { id: string; state: BookingState }, actor: AuthUser, note: string) {
    return this.builds.insertEvent(trx, {
      bookingId: booking.id,
      from: booking.state,
      to: booking.state,
      actorId: actor.id,
      actorLabel: actorLabel(actor),
      note,
    });
  }
}

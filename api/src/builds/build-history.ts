import { Injectable } from '@nestjs/common';
import type { Updateable } from 'kysely';
import type { AuthUser, BookingState } from '@loomwright/shared';
import { actorOf, BookingsService } from '../bookings/bookings.service';
import type { BookingsTable, Executor } from '../database/database';

export const stateWords = (state: string) => state.replace(/_/g, ' ');

/**
 * Every change to a build goes through here so it lands in booking_events with who and when,
 * in the same transaction as the change itself. State moves use the bookings domain's own
 * transition, so the storefront timeline and the backoffice read one history.
 */
@Injectable()
export class BuildHistory {
  constructor(private readonly bookings: BookingsService) {}

  async move(
    trx: Executor,
    booking: { id: string },
    allowedFrom: BookingState[],
    to: BookingState,
    actor: AuthUser,
    note: string,
    values: Updateable<BookingsTable> = {},
  ) {
    const moved = await this.bookings.transition(trx, booking.id, allowedFrom, to, actorOf(actor), note);
    return Object.keys(values).length ? this.bookings.update(trx, booking.id, values) : moved;
  }

  /**
   * A change that keeps the state (hours, intake, extras, layout, a staff note): still one line
   * of history. Internal unless the caller says the player should read it: a staff member's words
   * reach the player only when they chose so.
   */
  note(
    trx: Executor,
    booking: { id: string; state: BookingState },
    actor: AuthUser,
    note: string,
    visibility: 'player' | 'internal' = 'internal',
  ) {
    return this.bookings.insertNote(trx, booking, actorOf(actor), note, visibility);
  }
}

import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import type {
  AuthUser,
  BookingDetail,
  BookingState,
  BookingSummary,
  CreateBookingInput,
  ListBookingsQuery,
  Page,
  RigConfiguration,
  ShipmentInput,
} from '@loomwright/shared';
import { bookingStateLabels, encodeBookingListCursor, staffRoles, type MoneyFacts } from '@loomwright/shared';
import { bookingMoneyFacts } from './booking-money';
import { Database, type Executor } from '../database/database';
import { MailService } from '../mail/mail.service';
import { quoteMailLines } from '../mail/quote-mail-lines';
import { detailView, pickQuotes, playerView, summaryView } from './booking-view';
import { BookingsRepository, type BookingRow, type ExtraRow, type PaymentRow, type QuoteRow } from './bookings.repository';
import { QuotePricer } from './quote-pricer';

/** Who made a change, as the timeline shows it. `id` is null for the system (e.g. a webhook). */
export interface BookingActor {
  id: string | null;
  label: string;
}

/** The staff's full view inside the API: the customer's address is always there (mails go to it). */
export type FullBookingDetail = BookingDetail & { customer: { email: string } };

/** An estimate holds its price this long; after that the shop re-prices before accepting. */
export const QUOTE_VALID_DAYS = 30;

export const actorOf = (user: AuthUser): BookingActor => ({ id: user.id, label: user.name });
const isStaff = (user: AuthUser) => staffRoles.includes(user.role);

@Injectable()
export class BookingsService {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsRepository,
    private readonly pricer: QuotePricer,
    private readonly mail: MailService,
  ) {}

  /** A player's request: re-priced here (the client's figures are never trusted) and snapshotted. */
  async create(user: AuthUser, dto: CreateBookingInput): Promise<BookingDetail> {
    const configuration = dto.configuration as RigConfiguration;
    const id = await this.db.transaction().execute(async (trx) => {
      const estimate = await this.pricer.price(configuration, trx);
      const reference = await this.bookings.nextReference(trx);
      const booking = await this.bookings.insertBooking(trx, {
        reference,
        customer_id: user.id,
        state: 'requested',
        configuration: JSON.stringify(configuration),
        customer_notes: dto.notes?.trim() ?? '',
      });
      const expiresAt = new Date(Date.now() + QUOTE_VALID_DAYS * 24 * 60 * 60 * 1000);
      await this.bookings.insertQuote(trx, {
        booking_id: booking.id,
        kind: 'estimate',
        price_book_version: estimate.priceBookVersion,
        currency: estimate.currency,
        configuration: JSON.stringify(configuration),
        estimate: JSON.stringify(estimate),
        labor_hours: estimate.laborHours,
        total_low: estimate.totalLow,
        total_high: estimate.totalHigh,
        deposit: estimate.deposit,
        expires_at: expiresAt,
      });
      await this.bookings.insertEvent(trx, {
        booking_id: booking.id,
        from_state: null,
        to_state: 'requested',
        actor_id: user.id,
        actor_label: user.name,
        note: 'Build requested from the storefront.',
      });
      await this.mail.enqueue(trx, {
        template: 'booking-requested',
        to: user.email,
        bookingId: booking.id,
        userId: user.id,
        data: {
          name: user.name,
          reference,
          totalLow: estimate.totalLow,
          totalHigh: estimate.totalHigh,
          deposit: estimate.deposit,
          currency: estimate.currency,
          quoteExpiresAt: expiresAt.toISOString(),
          lines: quoteMailLines(estimate),
        },
        dedupeKey: `booking-requested:${booking.id}`,
      });
      return booking.id;
    });
    return this.getDetail(id);
  }

  async list(user: AuthUser, query: ListBookingsQuery): Promise<Page<BookingSummary>> {
    const { page, pageSize } = query;
    const { rows, total } = await this.bookings.list({
      customerId: isStaff(user) ? undefined : user.id,
      state: query.state,
      depositStatus: query.deposit,
      q: query.q?.trim() || undefined,
      emailSearchForBuilderUserId: user.role === 'builder' ? user.id : undefined,
      sort: query.sort,
      order: query.order,
      limit: pageSize,
      offset: (page - 1) * pageSize,
      after: query.cursor ? { key: query.cursor.key, id: query.cursor.id } : undefined,
    });
    const quotes = await this.bookings.quoteSummariesFor(rows.map((r) => r.id));
    const last = rows.length === pageSize ? rows[rows.length - 1] : undefined;
    return {
      items: rows.map((row) =>
        summaryView(
          row,
          quotes.filter((q) => q.booking_id === row.id),
        ),
      ),
      total,
      page,
      pageSize,
      nextCursor: last ? encodeBookingListCursor({ sort: query.sort, order: query.order, key: last.sort_key, id: last.id }) : null,
    };
  }

  /** The full booking (staff view); throws 404 when it does not exist. */
  async getDetail(id: string, trx: Executor = this.db): Promise<FullBookingDetail> {
    const row = await this.bookings.findListRow(id, trx);
    if (!row) throw new NotFoundException(`There is no booking ${id}.`);
    const [quotes, payments, events, photos, extras, layoutApprovals] = await Promise.all([
      this.bookings.quotesFor([id], trx),
      this.bookings.paymentsFor(id, trx),
      this.bookings.eventsFor(id, trx),
      this.bookings.photosFor(id, trx),
      this.bookings.extrasFor(id, trx),
      this.bookings.layoutApprovalsFor(id, trx),
    ]);
    const money = this.factsOf(row, quotes, extras, payments);
    return detailView(row, { quotes, payments, events, photos, extras, layoutApprovals, money }) as FullBookingDetail;
  }

  /**
   * As getDetail, but a player only ever sees their own (another's booking is simply not there),
   * and only the history lines meant for them: staff notes, hours and intake remarks stay internal.
   */
  async getDetailFor(user: AuthUser, id: string): Promise<BookingDetail> {
    await this.findVisible(user, id);
    const detail = await this.getDetail(id);
    return isStaff(user) ? detail : playerView(detail);
  }

  async findVisible(user: AuthUser, id: string, trx: Executor = this.db): Promise<BookingRow> {
    const row = await this.bookings.findById(id, trx);
    if (!row || (!isStaff(user) && row.customer_id !== user.id)) {
      throw new NotFoundException(`There is no booking ${id} in your account.`);
    }
    return row;
  }

  /**
   * The booking's money facts (firm total, approved extras, payments, refunds, balance due), read
   * in the caller's transaction. Every figure anyone sees about a booking's money comes from here.
   */
  async moneyFacts(id: string, trx: Executor = this.db): Promise<MoneyFacts> {
    const row = await this.bookings.findById(id, trx);
    if (!row) throw new NotFoundException(`There is no booking ${id}.`);
    const [quotes, extras, payments] = await Promise.all([
      this.bookings.quotesFor([id], trx),
      this.bookings.extrasFor(id, trx),
      this.bookings.paymentsFor(id, trx),
    ]);
    return this.factsOf(row, quotes, extras, payments);
  }

  private factsOf(row: BookingRow, quotes: QuoteRow[], extras: ExtraRow[], payments: PaymentRow[]): MoneyFacts {
    const { estimate, firm } = pickQuotes(quotes);
    return bookingMoneyFacts({ firm, estimate, extras, payments, balanceWaivedReason: row.balance_waived_reason });
  }

  /**
   * Moves a booking from one of `allowedFrom` to `to` and records who did it. The row is locked
   * `for update`, so two concurrent changes to one booking are applied one after the other and the
   * second sees the first's state.
   */
  async transition(
    trx: Executor,
    bookingId: string,
    allowedFrom: BookingState[],
    to: BookingState,
    actor: BookingActor,
    note = '',
    visibility: 'player' | 'internal' = 'player',
  ): Promise<BookingRow> {
    const row = await this.bookings.lockById(trx, bookingId);
    if (!row) throw new NotFoundException(`There is no booking ${bookingId}.`);
    if (!allowedFrom.includes(row.state)) {
      throw new ConflictException(
        `Booking ${row.reference} is "${bookingStateLabels[row.state]}", so it cannot become "${bookingStateLabels[to]}"; ` +
          `that needs it to be ${allowedFrom.map((s) => `"${bookingStateLabels[s]}"`).join(' or ')}.`,
      );
    }
    const updated = await this.bookings.update(trx, bookingId, { state: to });
    await this.bookings.insertEvent(trx, {
      booking_id: bookingId,
      from_state: row.state,
      to_state: to,
      actor_id: actor.id,
      actor_label: actor.label,
      note,
      visibility,
    });
    return updated;
  }

  /** A history line that keeps the state (a payment taken, a reminder sent); the player reads it unless 'internal'. */
  insertNote(
    trx: Executor,
    booking: { id: string; state: BookingState },
    actor: BookingActor,
    note: string,
    visibility: 'player' | 'internal' = 'player',
  ) {
    return this.bookings.insertEvent(trx, {
      booking_id: booking.id,
      from_state: booking.state,
      to_state: booking.state,
      actor_id: actor.id,
      actor_label: actor.label,
      note,
      visibility,
    });
  }

  /** The newest quote of a booking, of one kind or either: the one place "latest quote" is decided. */
  latestQuote(bookingId: string, kind?: QuoteRow['kind'], trx: Executor = this.db) {
    return this.bookings.latestQuote(trx, bookingId, kind);
  }

  /** Locks the row and returns it, for callers that change a booking without changing its state. */
  lock(trx: Executor, bookingId: string) {
    return this.bookings.lockById(trx, bookingId);
  }

  update(trx: Executor, bookingId: string, patch: Parameters<BookingsRepository['update']>[2]) {
    return this.bookings.update(trx, bookingId, patch);
  }

  /** The player records the parcel carrying their pedals to the shop. */
  async recordShipment(user: AuthUser, id: string, dto: ShipmentInput): Promise<BookingDetail> {
    await this.db.transaction().execute(async (trx) => {
      const row = await this.findVisible(user, id, trx);
      const locked = await this.bookings.lockById(trx, row.id);
      const open: BookingState[] = ['requested', 'deposit_paid', 'scheduled'];
      if (!locked || !open.includes(locked.state)) {
        throw new ConflictException(
          `Booking ${row.reference} is "${bookingStateLabels[row.state]}"; tracking can be recorded until the shop checks the pedals in.`,
        );
      }
      await this.bookings.update(trx, id, { inbound_carrier: dto.carrier.trim(), inbound_tracking: dto.tracking.trim() });
      await this.bookings.insertEvent(trx, {
        booking_id: id,
        from_state: locked.state,
        to_state: locked.state,
        actor_id: user.id,
        actor_label: user.name,
        note: `Pedals shipped with ${dto.carrier.trim()}, tracking ${dto.tracking.trim()}.`,
      });
    });
    return this.getDetail(id);
  }
}

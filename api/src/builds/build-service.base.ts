import { ConflictException, Inject, NotFoundException } from '@nestjs/common';
import { errorResponse, type BookingState, type ErrorCode } from '@loomwright/shared';
import { BenchService, type PlanningFacts, type ShopCalendar } from '../bench/bench.service';
import { addDays } from '../bench/calendar-days';
import { toHours, type BuildPlan } from '../bench/scheduling';
import { BookingsRepository } from '../bookings/bookings.repository';
import { BookingsService } from '../bookings/bookings.service';
import { dayWords } from '../common/shop-voice';
import { Database, type Executor } from '../database/database';
import { MailService } from '../mail/mail.service';
import { PaymentsService } from '../payments/payments.service';
import { ShopRepository } from '../shop/shop.repository';
import { BuildHistory, stateWords } from './build-history';
import { BuildsRepository } from './builds.repository';
import { firmQuoteFigures, type FirmQuoteFigures } from './firm-quote';

type LockedBooking = NonNullable<Awaited<ReturnType<BookingsRepository['lockWithCustomer']>>>;
type LockedBuilder = NonNullable<Awaited<ReturnType<BenchService['lockBuilder']>>>;
type PlacedPlan = Extract<BuildPlan, { ok: true }>;
type QuoteBasis = Pick<PlanningFacts['estimateQuote'], 'price_book_version' | 'currency' | 'configuration' | 'estimate'>;

/**
 * What every service that changes a build works with (the builds, bench-changes, records and
 * approvals services): the repositories, the bench, the bookings, payments, history and mail, and the steps they
 * share: lock the booking (with its player) and check its state, lock the builder it goes to, plan
 * it on the bench, write a firm quote. The dependencies are injected by property, Nest's way for a
 * base class, so the services need no constructor of their own.
 */
export abstract class BuildServiceBase {
  @Inject() protected readonly db: Database;
  @Inject() protected readonly builds: BuildsRepository;
  @Inject() protected readonly bookingRows: BookingsRepository;
  @Inject() protected readonly shopRows: ShopRepository;
  @Inject() protected readonly bench: BenchService;
  @Inject() protected readonly history: BuildHistory;
  @Inject() protected readonly mail: MailService;
  @Inject() protected readonly bookings: BookingsService;
  @Inject() protected readonly payments: PaymentsService;

  /** Locks the booking with its player until the transaction ends (state changes on one booking queue up); 404 if there is none. */
  protected async lockBooking(trx: Executor, bookingId: string): Promise<LockedBooking> {
    const booking = await this.bookingRows.lockWithCustomer(trx, bookingId);
    if (!booking) throw new NotFoundException('There is no booking with that id.');
    return booking;
  }

  /** The same lock, refused with a 409 ("Booking LW-… is <state>; <why>") unless the booking is in one of `states`. */
  protected async lockInState(trx: Executor, bookingId: string, states: BookingState[], why: string, code?: ErrorCode) {
    const booking = await this.lockBooking(trx, bookingId);
    if (!states.includes(booking.state)) {
      const message = `Booking ${booking.reference} is ${stateWords(booking.state)}; ${why}`;
      throw new ConflictException(code ? errorResponse(code, message) : message);
    }
    return booking;
  }

  /**
   * The booking's planning facts, then the builder it goes to, locked (always after the booking, so
   * two planners never deadlock); 404 if they are not on the team, 409 if they take no builds.
   */
  protected async factsAndBuilder(
    trx: Executor,
    bookingId: string,
    builderId: string,
  ): Promise<{ facts: PlanningFacts; builder: LockedBuilder }> {
    const facts = await this.bench.planningFacts(trx, bookingId);
    const builder = await this.bench.lockBuilder(trx, builderId);
    if (!builder) throw new NotFoundException('That builder is not on the team; choose one from the list.');
    assertTakesBuilds(builder);
    return { facts, builder };
  }

  /**
   * The build planned from `benchDate` on the builder's bench as it is now (leaving out its own
   * slices when `bookingId` moves), refused in words when the day or the hours do not fit.
   */
  protected async planOnBench(
    trx: Executor,
    booking: { id: string; state: BookingState },
    builder: LockedBuilder,
    laborHours: string,
    benchDate: string,
    moving = false,
  ): Promise<{ shop: ShopCalendar; plan: PlacedPlan }> {
    const shop = await this.bench.shopCalendar(trx);
    const plan = await this.bench.planFor(trx, builder, laborHours, shop, { benchDate }, moving ? booking.id : undefined);
    this.bench.assertBenchDate(booking.state, benchDate, this.bench.calendarOf(builder, shop), shop, plan);
    return { shop, plan };
  }

  /** A firm quote at the builder's rate over the quote it is based on; it holds a year past the build's expected completion. */
  protected async insertFirmQuote(
    trx: Executor,
    bookingId: string,
    basis: QuoteBasis,
    facts: Pick<PlanningFacts, 'laborHours' | 'materialsTotal'>,
    builder: Pick<LockedBuilder, 'id' | 'hourly_rate'>,
    deposit: string,
    plan: Pick<PlacedPlan, 'expectedCompletion'>,
  ): Promise<{ id: string; figures: FirmQuoteFigures }> {
    const figures = firmQuoteFigures({
      hourlyRate: builder.hourly_rate,
      laborHours: facts.laborHours,
      materialsTotal: facts.materialsTotal,
      deposit,
    });
    const row = await this.bookingRows.insertQuote(trx, {
      booking_id: bookingId,
      kind: 'firm',
      price_book_version: basis.price_book_version,
      currency: basis.currency,
      configuration: JSON.stringify(basis.configuration),
      estimate: JSON.stringify(basis.estimate),
      labor_hours: facts.laborHours,
      total_low: figures.total,
      total_high: figures.total,
      deposit,
      hourly_rate: builder.hourly_rate,
      labor_total: figures.laborTotal,
      total: figures.total,
      builder_id: builder.id,
      // A firm quote holds for the build it was given for; a year covers any queue we plan.
      expires_at: new Date(Date.parse(`${addDays(plan.expectedCompletion, 365)}T00:00:00Z`)),
    });
    return { id: row.id, figures };
  }

  /** The shop's formatter and its day words, for history lines and refusals. */
  protected async shopVoice(trx: Executor) {
    const voice = await this.shopRows.formatOf(trx);
    return { voice, formatDay: (day: string) => dayWords(voice, day) };
  }
}

/** The days of a plan as the answers show them: each day with its hours. */
export function planDays(plan: PlacedPlan) {
  return plan.days.map((d) => ({ date: d.day, hours: toHours(d.hours) }));
}

/** Only a builder who is on the team and has joined (not a pending invitation) takes builds. */
export function assertTakesBuilds(builder: { name: string; active: boolean; joined: boolean }) {
  if (!builder.active) throw new ConflictException(`${builder.name} is not taking builds (inactive on the team).`);
  if (!builder.joined) throw new ConflictException(`${builder.name} has not accepted their invitation yet, so they cannot take builds.`);
}

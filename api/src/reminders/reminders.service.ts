import { Injectable, Logger } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import Decimal from 'decimal.js';
import {
  reminderKinds,
  reminderLimits,
  reminderWords,
  shopFormat,
  type ReminderKind,
  type ReminderSettingsView,
  type ShopFormat,
  type UpdateReminderSettingsInput,
} from '@loomwright/shared';
import { addDays, daysBetween } from '../bench/calendar-days';
import { shipByDate } from '../bench/scheduling';
import { BenchService } from '../bench/bench.service';
import { BookingsService, type BookingActor } from '../bookings/bookings.service';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { MailService } from '../mail/mail.service';
import { PaymentsService } from '../payments/payments.service';
import { ReminderClock } from './reminder-clock';
import { RemindersRepository } from './reminders.repository';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;
/** The ship lead is three shop working days; holidays and closures can stretch it, never past this many calendar days. */
const SHIP_LEAD_SPAN_DAYS = 40;

export const reminderActor: BookingActor = { id: null, label: reminderWords.actor };

/** What one sweep did, for the log and the tests. */
export type SweepResult = Record<ReminderKind, number>;

/** The amount column of each kind in the API's field name (daysBefore, …). */
const fieldOf = (kind: ReminderKind) => reminderLimits[kind].field;

/**
 * The reminders and the expiry of unpaid requests, run by the job queue (RemindersWorker) on a
 * schedule. A sweep reads what is due at the clock's "now", then handles each booking in its own
 * transaction: lock the booking, ask again whether the reminder is still due (a payment or a
 * tracking number may have arrived), claim the reminder's unique key, queue its mail and write its
 * history line. The claim is the database's unique index, so two API processes sweeping at the same
 * moment send each reminder once; a transaction that fails sends nothing and leaves no claim, so the
 * next sweep tries again.
 */
@Injectable()
export class RemindersService {
  private readonly logger = new Logger('Reminders');

  constructor(
    private readonly db: Database,
    private readonly reminders: RemindersRepository,
    private readonly bookings: BookingsService,
    private readonly payments: PaymentsService,
    private readonly bench: BenchService,
    private readonly mail: MailService,
    private readonly clock: ReminderClock,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  async settings(trx: Executor = this.db): Promise<ReminderSettingsView> {
    const rows = new Map((await this.reminders.settings(trx)).map((r) => [r.kind, r]));
    const view = {} as Record<ReminderKind, Record<string, unknown>>;
    for (const kind of reminderKinds) {
      const row = rows.get(kind);
      view[kind] = { enabled: row?.enabled ?? false, [fieldOf(kind)]: row?.amount ?? reminderLimits[kind].min };
    }
    return view as unknown as ReminderSettingsView;
  }

  async updateSettings(input: UpdateReminderSettingsInput, by: string): Promise<ReminderSettingsView> {
    await this.db.transaction().execute(async (trx) => {
      for (const kind of reminderKinds) {
        const change = input[kind] as Record<string, unknown> | undefined;
        if (!change) continue;
        const amount = change[fieldOf(kind)] as number | undefined;
        const enabled = change.enabled as boolean | undefined;
        await this.reminders.updateSetting(
          trx,
          kind,
          { ...(enabled !== undefined && { enabled }), ...(amount !== undefined && { amount }) },
          by,
        );
      }
    });
    return this.settings();
  }

  /** One sweep at the clock's now: every reminder due is sent once, every request due expires once. */
  async runDue(now: Date = this.clock.now()): Promise<SweepResult> {
    const settings = await this.settings();
    const shop = await this.reminders.shop();
    const format = shopFormat({ locale: shop?.locale, currency: shop?.currency.trim(), timeZone: shop?.timezone ?? 'UTC' });
    const result: SweepResult = { shipBy: 0, balanceUnpaid: 0, checkoutAbandoned: 0, requestExpiry: 0 };
    const context = { now, format, shopEmail: shop?.contact_email ?? null };
    // Expiry first: a request closed now gets its one letter, not also an unfinished-checkout reminder.
    if (settings.requestExpiry.enabled) {
      const before = new Date(now.getTime() - settings.requestExpiry.daysUnpaid * DAY_MS);
      result.requestExpiry = await this.each(await this.reminders.requestsUnpaid(before), (c) =>
        this.expireRequest(c.id, before, settings.requestExpiry.daysUnpaid, context),
      );
    }
    if (settings.shipBy.enabled)
      result.shipBy = await this.each(await this.shipByCandidates(now, format, settings.shipBy.daysBefore), (c) =>
        this.remindShipBy(c, settings.shipBy.daysBefore, context),
      );
    if (settings.balanceUnpaid.enabled) {
      const before = new Date(now.getTime() - settings.balanceUnpaid.daysAfterReady * DAY_MS);
      result.balanceUnpaid = await this.each(await this.reminders.balanceDue(before), (c) =>
        this.remindBalance(c.id, before, settings.balanceUnpaid.daysAfterReady, context),
      );
    }
    if (settings.checkoutAbandoned.enabled) {
      const before = new Date(now.getTime() - settings.checkoutAbandoned.hoursAfter * HOUR_MS);
      result.checkoutAbandoned = await this.each(await this.reminders.checkoutsUnfinished(before), (c) =>
        this.remindCheckout(c.id, c.payment_id, before, settings.checkoutAbandoned.hoursAfter, context),
      );
    }
    if (Object.values(result).some((n) => n > 0)) this.logger.log(`Reminders sent: ${JSON.stringify(result)}`);
    return result;
  }

  /** One booking's failure (the provider out of reach, say) never stops the others; the next sweep tries it again. */
  private async each<T extends { id: string }>(candidates: T[], handle: (candidate: T) => Promise<boolean>): Promise<number> {
    let sent = 0;
    for (const candidate of candidates) {
      try {
        if (await handle(candidate)) sent++;
      } catch (error) {
        this.logger.warn(
          `Reminder for booking ${candidate.id} not sent this time: ${error instanceof Error ? error.message : String(error)}`,
        );
      }
    }
    return sent;
  }

  private publicUrl() {
    return this.config.get('app', { infer: true }).publicUrl;
  }

  private async shipByCandidates(now: Date, format: ShopFormat, daysBefore: number) {
    const today = format.today(now);
    const calendar = await this.bench.shopCalendar();
    const rows = await this.reminders.shipByDue({ from: today, to: addDays(today, daysBefore + SHIP_LEAD_SPAN_DAYS) });
    return rows
      .map((row) => ({ ...row, shipBy: shipByDate(row.bench_date!, calendar) }))
      .filter((row) => today <= row.shipBy && daysBetween(today, row.shipBy) <= daysBefore)
      .map((row) => ({ ...row, today, calendar }));
  }

  private async remindShipBy(
    candidate: Awaited<ReturnType<RemindersService['shipByCandidates']>>[number],
    daysBefore: number,
    { format, shopEmail }: { format: ShopFormat; shopEmail: string | null },
  ): Promise<boolean> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, candidate.id);
      const [row] = await this.reminders.shipByDue({ from: candidate.today, to: candidate.bench_date! }, candidate.id, trx);
      if (!booking || !row || row.bench_date !== candidate.bench_date) return false;
      // The event is the ship-by day itself: a build moved to another bench date is reminded again for its new day.
      const claimed = await this.reminders.claim(trx, {
        kind: 'shipBy',
        bookingId: row.id,
        eventKey: `ship-by:${candidate.shipBy}`,
        dueAt: dayStart(addDays(candidate.shipBy, -daysBefore)),
      });
      if (!claimed) return false;
      const daysLeft = daysBetween(candidate.today, candidate.shipBy);
      const shipByWords = format.day(candidate.shipBy, { year: 'always' });
      await this.mail.enqueue(trx, {
        template: 'ship-by-reminder',
        to: row.customer_email,
        bookingId: row.id,
        userId: row.customer_id,
        dedupeKey: `reminder:shipBy:${row.id}:${candidate.shipBy}:player`,
        data: {
          name: row.customer_name,
          reference: row.reference,
          shipBy: candidate.shipBy,
          // The due query found this row by its bench date (checked equal to the candidate's above).
          benchDate: row.bench_date!,
          daysLeft,
          bookingUrl: `${this.publicUrl()}/builds/${row.id}`,
        },
      });
      await this.bookings.insertNote(
        trx,
        booking,
        reminderActor,
        reminderWords.shipByPlayerNote(shipByWords, row.customer_name),
        'internal',
      );
      const shopTo = row.builder_email ?? shopEmail;
      if (shopTo) {
        await this.mail.enqueue(trx, {
          template: 'shop-ship-by-reminder',
          to: shopTo,
          bookingId: row.id,
          userId: row.builder_user_id,
          dedupeKey: `reminder:shipBy:${row.id}:${candidate.shipBy}:shop`,
          data: {
            name: row.builder_name ?? 'the shop',
            reference: row.reference,
            playerName: row.customer_name,
            shipBy: candidate.shipBy,
            benchDate: row.bench_date!,
            backofficeUrl: `${this.publicUrl()}/backoffice/requests/${row.id}`,
          },
        });
        await this.bookings.insertNote(
          trx,
          booking,
          reminderActor,
          reminderWords.shipByShopNote(shipByWords, row.builder_name ?? shopTo),
          'internal',
        );
      }
      return true;
    });
  }

  private remindBalance(bookingId: string, readyBefore: Date, days: number, { format }: { format: ShopFormat }): Promise<boolean> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, bookingId);
      const [row] = await this.reminders.balanceDue(readyBefore, bookingId, trx);
      if (!booking || !row) return false;
      const money = await this.bookings.moneyFacts(bookingId, trx);
      // Paid, waived, or a bank debit settling: nothing to remind.
      if (money.settled || !money.balanceDue || !new Decimal(money.balanceDue).gt(0)) return false;
      if (await this.reminders.hasPayment(trx, bookingId, 'balance', ['processing'])) return false;
      if (
        !(await this.reminders.claim(trx, {
          kind: 'balanceUnpaid',
          bookingId,
          eventKey: `ready:${row.ready_event_id}`,
          dueAt: new Date(new Date(row.ready_at).getTime() + days * DAY_MS),
        }))
      )
        return false;
      const readySince = format.today(new Date(row.ready_at));
      await this.mail.enqueue(trx, {
        template: 'balance-reminder',
        to: row.customer_email,
        bookingId,
        userId: row.customer_id,
        dedupeKey: `reminder:balanceUnpaid:${bookingId}:${row.ready_event_id}`,
        data: {
          name: row.customer_name,
          reference: row.reference,
          balanceDue: money.balanceDue,
          currency: money.currency,
          readySince,
          payUrl: `${this.publicUrl()}/builds/${bookingId}`,
        },
      });
      await this.bookings.insertNote(
        trx,
        booking,
        reminderActor,
        reminderWords.balanceNote(format.money(money.balanceDue, money.currency), days),
        'internal',
      );
      return true;
    });
  }

  private remindCheckout(
    bookingId: string,
    paymentId: string,
    openedBefore: Date,
    hours: number,
    { format }: { format: ShopFormat },
  ): Promise<boolean> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, bookingId);
      const row = (await this.reminders.checkoutsUnfinished(openedBefore, bookingId, trx)).find((r) => r.payment_id === paymentId);
      if (!booking || !row) return false;
      if (await this.reminders.hasPayment(trx, bookingId, row.kind, ['processing', 'paid'])) return false;
      // Once per booking and kind of payment: a player who opens a second checkout and leaves it too is not reminded again.
      if (
        !(await this.reminders.claim(trx, {
          kind: 'checkoutAbandoned',
          bookingId,
          eventKey: `checkout:${row.kind}`,
          dueAt: new Date(new Date(row.opened_at).getTime() + hours * HOUR_MS),
        }))
      )
        return false;
      const currency = row.currency.trim();
      await this.mail.enqueue(trx, {
        template: 'checkout-reminder',
        to: row.customer_email,
        bookingId,
        userId: row.customer_id,
        dedupeKey: `reminder:checkoutAbandoned:${bookingId}:${row.kind}`,
        data: {
          name: row.customer_name,
          reference: row.reference,
          kind: row.kind,
          amount: row.amount,
          currency,
          payUrl: `${this.publicUrl()}/builds/${bookingId}`,
        },
      });
      await this.bookings.insertNote(
        trx,
        booking,
        reminderActor,
        reminderWords.checkoutNote(`${row.kind} of ${format.money(row.amount, currency)}`, hours),
        'internal',
      );
      return true;
    });
  }

  /**
   * Closes a request whose deposit was not paid in time, through the one transition path (its
   * history line is the player's), after closing its unfinished checkouts so nothing can be paid
   * on it later. A request never holds bench time; should one hold any, it is left alone for the
   * shop to look at rather than releasing hours here.
   */
  private expireRequest(bookingId: string, requestedBefore: Date, days: number, _context: { format: ShopFormat }): Promise<boolean> {
    return this.db.transaction().execute(async (trx) => {
      const booking = await this.bookings.lock(trx, bookingId);
      const [row] = await this.reminders.requestsUnpaid(requestedBefore, bookingId, trx);
      if (!booking || !row) return false;
      if ((await this.reminders.benchHoursHeld(trx, bookingId)) > 0) {
        this.logger.warn(`Request ${row.reference} holds bench time; it is not expired automatically.`);
        return false;
      }
      if (await this.reminders.hasPayment(trx, bookingId, 'deposit', ['processing', 'paid'])) return false;
      if (
        !(await this.reminders.claim(trx, {
          kind: 'requestExpiry',
          bookingId,
          eventKey: 'requested',
          dueAt: new Date(new Date(row.created_at).getTime() + days * DAY_MS),
        }))
      )
        return false;
      // Money on its way keeps the request open; throwing undoes the claim, so a later sweep looks again.
      if (!(await this.payments.closeUnfinishedCheckouts(trx, bookingId))) throw new RequestStillPaying(row.reference);
      const note = reminderWords.expiredNote(days);
      await this.bookings.transition(trx, bookingId, ['requested'], 'cancelled', reminderActor, note);
      await this.bookings.update(trx, bookingId, { cancel_reason: note });
      await this.mail.enqueue(trx, {
        template: 'request-expired',
        to: row.customer_email,
        bookingId,
        userId: row.customer_id,
        dedupeKey: `reminder:requestExpiry:${bookingId}`,
        data: { name: row.customer_name, reference: row.reference, days, configureUrl: `${this.publicUrl()}/configure` },
      });
      return true;
    });
  }
}

/** A request with a payment under way (paid, settling, or just completed) is not expired. */
class RequestStillPaying extends Error {
  constructor(reference: string) {
    super(`Request ${reference} has a payment under way; it stays open.`);
  }
}

/** Midnight UTC of a calendar day: when a day-based reminder fell due, for the record. */
const dayStart = (day: string) => new Date(`${day}T00:00:00Z`);

import { z } from 'zod';
import { calendarDay, requestObject } from './request-fields';
import { rules } from './words';

/**
 * The shop office's queries: exports and reports take a range of the shop's calendar days,
 * both ends included (`?from=2026-01-01&to=2026-03-31`).
 */

/** The longest range one export or report covers (ten years of days): enough for any bookkeeper, bounded for the server. */
export const MAX_RANGE_DAYS = 3660;

const dayNumber = (day: string) => Date.parse(`${day}T00:00:00Z`) / 86_400_000;

export const dateRangeQuerySchema = requestObject({
  from: calendarDay('First day'),
  to: calendarDay('Last day'),
})
  .refine((q) => q.from <= q.to, { error: rules.dayOrder('Last day', 'First day'), path: ['to'] })
  .refine((q) => dayNumber(q.to) - dayNumber(q.from) < MAX_RANGE_DAYS, {
    error: `The range from the first to the last day may span at most ${MAX_RANGE_DAYS} days; export it in parts`,
    path: ['to'],
  });
export type DateRangeQuery = z.infer<typeof dateRangeQuerySchema>;

/** The three CSV exports, by the file name each route answers. */
export const exportKinds = ['bookings', 'payments', 'hours'] as const;
export type ExportKind = (typeof exportKinds)[number];

/** Header rows of the CSV exports (the column names a bookkeeper's spreadsheet sees), in order. */
export const exportColumns = {
  bookings: [
    'reference',
    'requested_at',
    'state',
    'customer_name',
    'customer_email',
    'builder_name',
    'builder_level',
    'bench_date',
    'expected_completion',
    'currency',
    'estimate_low',
    'estimate_high',
    'deposit',
    'firm_total',
    'approved_extras',
    'total_owed',
    'paid',
    'refunded',
    'net_paid',
    'balance_due',
    'quoted_hours',
    'recorded_hours',
  ],
  payments: [
    'at',
    'entry',
    'payment_kind',
    'amount',
    'currency',
    'method',
    'reference',
    'customer_name',
    'customer_email',
    'payment_id',
    'provider_payment',
    'provider_refund',
  ],
  hours: ['worked_on', 'reference', 'builder_name', 'builder_level', 'hours', 'note', 'recorded_by', 'recorded_at'],
} as const satisfies Record<ExportKind, readonly string[]>;

/** Bench utilisation is drawn per ISO week, at most this many days at a time (a year and a bit). */
export const MAX_UTILISATION_DAYS = 400;

// ---- Report answers (GET /api/reports/*) ----

/** Money that arrived and went back in one calendar month of the shop (YYYY-MM), in one currency. */
export interface RevenueMonth {
  month: string;
  currency: string;
  deposits: string;
  balances: string;
  /** Money given back, as a positive amount. */
  refunds: string;
  /** deposits + balances − refunds. */
  net: string;
}

export interface RevenueReport {
  from: string;
  to: string;
  timeZone: string;
  months: RevenueMonth[];
  totals: Array<Omit<RevenueMonth, 'month'>>;
}

export type OutstandingKind = 'deposit' | 'balance' | 'credit';

export interface OutstandingItem {
  bookingId: string;
  reference: string;
  state: string;
  customerName: string;
  builderName: string | null;
  kind: OutstandingKind;
  amount: string;
  currency: string;
  /** Since when the money has been owed: the request for a deposit, the bench date for a balance. */
  since: string | null;
}

export interface OutstandingReport {
  asOf: string;
  items: OutstandingItem[];
  totals: Array<{ kind: OutstandingKind; currency: string; amount: string; count: number }>;
}

export interface HoursBuildRow {
  bookingId: string;
  reference: string;
  state: string;
  builderId: string | null;
  builderName: string | null;
  quotedHours: string;
  /** Hour entries worked on a day in the range (the hours.csv rows of this build). */
  hoursInRange: string;
  /** Every hour entry of the build so far. */
  hoursToDate: string;
  /** hoursToDate − quotedHours: positive is over the quote. */
  overQuote: string;
}

export interface HoursBuilderRow {
  builderId: string;
  builderName: string;
  level: string;
  /** Their own hour entries in the range (the hours.csv rows with their name). */
  hoursInRange: string;
  /** Builds assigned to them with hours in the range. */
  builds: number;
  quotedHours: string;
  hoursToDate: string;
  overQuote: string;
}

export interface HoursReport {
  from: string;
  to: string;
  builds: HoursBuildRow[];
  builders: HoursBuilderRow[];
}

export interface UtilisationWeek {
  /** The Monday of the ISO week (ISO 8601 weeks start on Monday). */
  weekStart: string;
  /** ISO 8601 week label, e.g. 2026-W49. */
  isoWeek: string;
  capacityHours: string;
  bookedHours: string;
  recordedHours: string;
  /** booked ÷ capacity as a percentage with one decimal; null in a week with no capacity. */
  bookedPercent: string | null;
  recordedPercent: string | null;
}

export interface UtilisationReport {
  from: string;
  to: string;
  builders: Array<{ builderId: string; builderName: string; level: string; weeks: UtilisationWeek[] }>;
}

/** A private calendar feed's link (GET /api/calendar-feeds): whoever has the link can read the feed. */
export interface CalendarFeedLink {
  id: string;
  scope: 'shop' | 'builder';
  builderId: string | null;
  builderName: string | null;
  /** https link to subscribe to. */
  url: string;
  /** The same link as webcal:, which calendar programs open as a subscription. */
  webcalUrl: string;
  rotatedAt: string | null;
}

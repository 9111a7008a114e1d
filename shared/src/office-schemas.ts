import { z } from 'zod';
import { calendarDay, requestObject } from './request-fields';

/**
 * The shop office's queries: exports and reports take a range of the shop's calendar days,
 * both ends included (`?from=2026-01-01&to=2026-03-31`).
 */

/** The longest range one export or report covers (ten years of days): enough for any bookkeeper, bounded for the server. */
export const MAX_RANGE_DAYS = 3660;

const dayNumber = (day: string) => Date.parse(`${day}T00:00:00Z`) / 86_400_000;

export const dateRangeQuerySchema = requestObject({
  from: calendarDay('from'),
  to: calendarDay('to'),
})
  .refine((q) => q.from <= q.to, { error: 'from must be on or before to', path: ['to'] })
  .refine((q) => dayNumber(q.to) - dayNumber(q.from) < MAX_RANGE_DAYS, {
    error: `The range from … to may span at most ${MAX_RANGE_DAYS} days; export it in parts`,
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

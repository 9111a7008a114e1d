import { z } from 'zod';
import { calendarDay, flag, requestObject, text, uuid } from './request-fields';
import { bookingWords, rules } from './words';

/**
 * Request bodies of the bench's change-of-plan routes, shared by the API (through its
 * ZodValidationPipe) and the backoffice's dialogs, so both refuse bad input in the same words.
 */

const reason = (tooShort: string) => text('reason', { max: 500, min: 1, tooShort });

/** POST /api/bookings/:id/reschedule: move a build to another day, another builder, or both. */
export const rescheduleSchema = requestObject({
  builderId: uuid('builderId', 'a builder'),
  benchDate: calendarDay('benchDate'),
  reason: reason(bookingWords.moveReason),
  /** Owner only: re-price the firm quote at the new builder's rate. */
  reprice: flag('reprice').optional(),
  /** Owner only: a builder below the level the player chose, and why (the player reads it). */
  levelOverrideReason: text('levelOverrideReason', { max: 500, min: 1, tooShort: bookingWords.levelOverrideReason }).optional(),
});
export type RescheduleInput = z.infer<typeof rescheduleSchema>;

/** Who asked for a cancellation after acceptance decides the refund (see the deposit policy). */
export const cancellationCauses = ['player', 'shop'] as const;
export type CancellationCause = (typeof cancellationCauses)[number];

/** POST /api/bookings/:id/cancel-scheduled (owner): cancel a build that already has bench time. */
export const cancelScheduledSchema = requestObject({
  reason: reason(bookingWords.cancelReason),
  cause: z.enum(cancellationCauses, { error: bookingWords.cancelCause }),
});
export type CancelScheduledInput = z.infer<typeof cancelScheduledSchema>;

/** POST /api/bookings/:id/price-consent (the booking's player). */
export const priceConsentSchema = requestObject({
  accept: z.boolean({ error: bookingWords.priceConsent }),
});
export type PriceConsentInput = z.infer<typeof priceConsentSchema>;

/** POST /api/team/:builderId/absences: days a builder is away (ill, holiday, a course). */
export const absenceSchema = requestObject({
  startsOn: calendarDay('startsOn'),
  endsOn: calendarDay('endsOn'),
  reason: reason(bookingWords.absenceReason),
}).refine((v) => v.endsOn >= v.startsOn, { error: rules.dayOrder('Last day', 'First day'), path: ['endsOn'] });
export type AbsenceInput = z.infer<typeof absenceSchema>;

/** GET /api/bench/preview?bookingId=&benchDate=&builderId= : what a date would mean, before choosing it. */
export const benchPreviewQuerySchema = requestObject({
  bookingId: uuid('bookingId', 'a booking'),
  benchDate: calendarDay('benchDate'),
  builderId: uuid('builderId', 'a builder').optional(),
});
export type BenchPreviewQuery = z.infer<typeof benchPreviewQuerySchema>;

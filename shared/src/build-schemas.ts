import { z } from 'zod';
import { benchStates } from './bench-types';
import { calendarDay, flag, hours, numberText, oneOf, positiveAmount, requestObject, text, uuid } from './request-fields';

/** POST /api/bookings/:id/accept: who builds it and from which day. */
export const acceptBookingSchema = requestObject({
  builderId: uuid('builderId', 'a builder'),
  benchDate: calendarDay('benchDate'),
  /** Owner only: why a builder below the rig's minimum level may take it. */
  levelOverrideReason: text('levelOverrideReason', { max: 500, min: 1, tooShort: 'levelOverrideReason must not be empty when given' }).optional(),
});
export type AcceptBookingInput = z.infer<typeof acceptBookingSchema>;

/** POST /api/bookings/:id/decline: the reason is told to the player. */
export const declineBookingSchema = requestObject({
  reason: text('reason', { max: 1000, min: 3, tooShort: 'reason must say why, in at least a few words' }),
});
export type DeclineBookingInput = z.infer<typeof declineBookingSchema>;

/** POST /api/bookings/:id/state: move a build on; the note goes on its history. */
export const changeStateSchema = requestObject({
  to: oneOf('to', benchStates),
  note: text('note', { max: 1000 }).optional(),
});
export type ChangeStateInput = z.infer<typeof changeStateSchema>;

/** POST /api/bookings/:id/waive-balance. */
export const waiveBalanceSchema = requestObject({
  reason: text('reason', { max: 1000, min: 3, tooShort: 'reason must say why the balance is waived' }),
});
export type WaiveBalanceInput = z.infer<typeof waiveBalanceSchema>;

/** Hours actually spent on one day: above 0, at most 24, at most two decimals (2.3 and 0.25 are fine). */
export const workedHoursField = hours('hours', { min: 0.01, max: 24, minWords: 'hours must be more than 0', maxWords: 'hours must be at most 24 for one day' });

/** POST /api/bookings/:id/time-entries. */
export const timeEntrySchema = requestObject({
  workedOn: calendarDay('workedOn'),
  hours: workedHoursField,
  note: text('note', { max: 1000 }).optional(),
  /** Owner only: whose hours these are (default the booking's builder). */
  builderId: uuid('builderId', 'a builder').optional(),
});
export type TimeEntryInput = z.infer<typeof timeEntrySchema>;

/** The backoffice's hours form: the hours typed as text, then the same rule as the API. */
export const timeEntryFormSchema = z.object({
  workedOn: calendarDay('workedOn'),
  hours: numberText('hours', workedHoursField),
  note: text('note', { max: 1000 }),
});
export type TimeEntryFormInput = z.input<typeof timeEntryFormSchema>;
export type TimeEntryFormOutput = z.output<typeof timeEntryFormSchema>;

export const intakeConditions = ['working', 'faulty'] as const;

/** POST /api/bookings/:id/intake: each pedal or part as it arrived. */
export const recordIntakeSchema = requestObject({
  items: z
    .array(
      requestObject({
        item: text('item', { max: 200, min: 1, tooShort: 'item must name the pedal or part' }),
        condition: oneOf('condition', intakeConditions),
        note: text('note', { max: 1000 }).optional(),
      }),
      { error: 'items must be a list' },
    )
    .min(1, { error: 'items must list at least one pedal or part' })
    .max(200, { error: 'items must list at most 200 pedals or parts' }),
});
export type RecordIntakeInput = z.infer<typeof recordIntakeSchema>;

/** POST /api/bookings/:id/extras: extra material the player is asked to approve, with its price. */
export const proposeExtraSchema = requestObject({
  description: text('description', { max: 300, min: 2, tooShort: 'description must say what the extra is' }),
  amount: positiveAmount('amount', 8, '45.00'),
  reason: text('reason', { max: 1000, min: 3, tooShort: 'reason must say why the extra is needed' }),
});
export type ProposeExtraInput = z.infer<typeof proposeExtraSchema>;

/** POST /api/bookings/:id/extras/:extraId/decision. */
export const decideExtraSchema = requestObject({ approve: flag('approve') });
export type DecideExtraInput = z.infer<typeof decideExtraSchema>;

/** POST /api/bookings/:id/layout/request and /layout/approve: an optional word about the layout. */
export const layoutNoteSchema = requestObject({ note: text('note', { max: 1000 }).optional() });
export type LayoutNoteInput = z.infer<typeof layoutNoteSchema>;

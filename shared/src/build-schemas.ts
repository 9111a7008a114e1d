import { z } from 'zod';
import { benchStates } from './bench-types';
import { calendarDay, flag, hours, numberText, oneOf, positiveAmount, requestObject, text, uuid } from './request-fields';
import { bookingWords } from './words';

/** POST /api/bookings/:id/accept: who builds it and from which day. */
export const acceptBookingSchema = requestObject({
  builderId: uuid('builderId', 'a builder'),
  benchDate: calendarDay('benchDate'),
  /** Owner only: why a builder below the rig's minimum level may take it. */
  levelOverrideReason: text('levelOverrideReason', { max: 500, min: 1, tooShort: bookingWords.levelOverrideReason }).optional(),
});
export type AcceptBookingInput = z.infer<typeof acceptBookingSchema>;

/** POST /api/bookings/:id/decline: the reason is told to the player. */
export const declineBookingSchema = requestObject({
  reason: text('reason', { max: 1000, min: 3, tooShort: bookingWords.declineReason }),
});
export type DeclineBookingInput = z.infer<typeof declineBookingSchema>;

/**
 * POST /api/bookings/:id/state: move a build on. The note stays internal unless `tellPlayer`:
 * then the player reads it on their page and in the status e-mail, word for word.
 */
export const changeStateSchema = requestObject({
  to: oneOf('to', benchStates),
  note: text('note', { max: 1000 }).optional(),
  tellPlayer: flag('tellPlayer').optional(),
}).refine((v) => !v.tellPlayer || !!v.note, { error: bookingWords.tellPlayerNeedsNote, path: ['note'] });
export type ChangeStateInput = z.infer<typeof changeStateSchema>;

/** POST /api/bookings/:id/waive-balance. */
export const waiveBalanceSchema = requestObject({
  reason: text('reason', { max: 1000, min: 3, tooShort: bookingWords.waiveReason }),
});
export type WaiveBalanceInput = z.infer<typeof waiveBalanceSchema>;

/** Hours actually spent on one day: above 0, at most 24, at most two decimals (2.3 and 0.25 are fine). */
export const workedHoursField = hours('hours', {
  min: 0.01,
  max: 24,
  minWords: bookingWords.hoursAboveZero,
  maxWords: bookingWords.hoursAtMost24,
});

/** POST /api/bookings/:id/time-entries. */
export const timeEntrySchema = requestObject({
  workedOn: calendarDay('workedOn'),
  hours: workedHoursField,
  note: text('note', { max: 1000 }).optional(),
  /** Owner only: whose hours these are (default the booking's builder). */
  builderId: uuid('builderId', 'a builder').optional(),
});
export type TimeEntryInput = z.infer<typeof timeEntrySchema>;

/** PATCH /api/bookings/:id/time-entries/:entryId: what changes, at least one field. */
export const editTimeEntrySchema = requestObject({
  workedOn: calendarDay('workedOn').optional(),
  hours: workedHoursField.optional(),
  note: text('note', { max: 1000 }).optional(),
}).refine((v) => v.workedOn !== undefined || v.hours !== undefined || v.note !== undefined, { error: bookingWords.timeEntryEmpty });
export type EditTimeEntryInput = z.infer<typeof editTimeEntrySchema>;

/** The backoffice's hours form: the hours typed as text, then the same rule as the API. */
export const timeEntryFormSchema = z.object({
  workedOn: calendarDay('workedOn'),
  hours: numberText('hours', workedHoursField),
  note: text('note', { max: 1000 }),
});
export type TimeEntryFormInput = z.input<typeof timeEntryFormSchema>;
export type TimeEntryFormOutput = z.output<typeof timeEntryFormSchema>;

export const intakeConditions = ['working', 'faulty'] as const;

/** One pedal or part as it arrived: a faulty one says what is wrong. */
export const intakeItemSchema = requestObject({
  item: text('item', { max: 200, min: 1, tooShort: bookingWords.intakeItem }),
  condition: oneOf('condition', intakeConditions),
  note: text('note', { max: 1000 }).optional(),
}).refine((i) => i.condition !== 'faulty' || !!i.note, { error: bookingWords.faultyNeedsNote, path: ['note'] });

/** POST /api/bookings/:id/intake: each item once; recording the same item again corrects it. */
export const recordIntakeSchema = requestObject({
  items: z
    .array(intakeItemSchema, { error: bookingWords.itemsList })
    .min(1, { error: bookingWords.itemsAtLeastOne })
    .max(200, { error: bookingWords.itemsAtMost(200) }),
});
export type RecordIntakeInput = z.infer<typeof recordIntakeSchema>;

/** POST /api/bookings/:id/extras: extra material the player is asked to approve, with its price. */
export const proposeExtraSchema = requestObject({
  description: text('description', { max: 300, min: 2, tooShort: bookingWords.extraDescription }),
  amount: positiveAmount('amount', 8, '45.00'),
  reason: text('reason', { max: 1000, min: 3, tooShort: bookingWords.extraReason }),
});
export type ProposeExtraInput = z.infer<typeof proposeExtraSchema>;

/** PATCH /api/bookings/:id/intake/:itemId: corrects one recorded item. */
export const editIntakeItemSchema = intakeItemSchema;
export type EditIntakeItemInput = z.infer<typeof editIntakeItemSchema>;

/** The player's answer (an extra or a layout), in the app: yes or no, with an optional comment. */
export const decideExtraSchema = requestObject({
  approve: flag('approve'),
  comment: text('comment', { max: 1000 }).optional(),
});
export type DecideExtraInput = z.infer<typeof decideExtraSchema>;
export const playerDecisionSchema = decideExtraSchema;
export type PlayerDecisionInput = DecideExtraInput;

/** How the shop heard an answer it records for the player. */
export const recordedViaValues = ['phone', 'in_person', 'email'] as const;
export type RecordedVia = (typeof recordedViaValues)[number];
export const decidedViaWords: Record<RecordedVia | 'app', string> = {
  app: 'in the app',
  phone: 'by phone',
  in_person: 'in person',
  email: 'by e-mail',
};

/** Staff record the player's answer given by phone, in person or by e-mail: who gave it and how. */
export const recordedDecisionSchema = requestObject({
  approve: flag('approve'),
  via: oneOf('via', recordedViaValues),
  givenBy: text('givenBy', { max: 200, min: 2, tooShort: bookingWords.givenBy }),
  comment: text('comment', { max: 1000 }).optional(),
});
export type RecordedDecisionInput = z.infer<typeof recordedDecisionSchema>;

/** POST /api/bookings/:id/layout/approve: an optional word about the layout. */
export const layoutNoteSchema = requestObject({ note: text('note', { max: 1000 }).optional() });
export type LayoutNoteInput = z.infer<typeof layoutNoteSchema>;

/** POST /api/bookings/:id/layout/request: the builder's words to the player with the top view (`note` is the older name). */
export const layoutRequestSchema = requestObject({
  message: text('message', { max: 1000 }).optional(),
  note: text('note', { max: 1000 }).optional(),
});
export type LayoutRequestInput = z.infer<typeof layoutRequestSchema>;

/** POST /api/bookings/:id/notes: a staff note, internal unless the writer tells the player. */
export const staffNoteSchema = requestObject({
  note: text('note', { max: 2000, min: 1, tooShort: bookingWords.staffNote }),
  tellPlayer: flag('tellPlayer').optional(),
});
export type StaffNoteInput = z.infer<typeof staffNoteSchema>;

/** How the shop took a payment itself. */
export const counterPaymentMethods = ['cash', 'card_terminal', 'bank_transfer'] as const;
export const paymentMethodWords: Record<(typeof counterPaymentMethods)[number] | 'checkout', string> = {
  checkout: 'online checkout',
  cash: 'cash',
  card_terminal: 'card at the counter',
  bank_transfer: 'bank transfer',
};

/** POST /api/bookings/:id/balance/record: the whole balance, taken in person. */
export const recordBalanceSchema = requestObject({
  amount: positiveAmount('amount', 10, '345.00'),
  method: oneOf('method', counterPaymentMethods),
  note: text('note', { max: 1000 }).optional(),
});
export type RecordBalanceInput = z.infer<typeof recordBalanceSchema>;

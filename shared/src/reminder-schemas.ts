import { z } from 'zod';
import { flag, numberText, requestObject } from './request-fields';
import { label, reminderWords, rules } from './words';

/**
 * The reminders the shop's job queue sends, and the expiry of unpaid requests. Each is on or off
 * and has one figure: when it goes out. Defaults (migration `reminders`) are common practice, no
 * published source: three days before the ship-by day, a week after the board is ready, a day
 * after an unfinished checkout, and thirty days for a request (as long as its estimate holds).
 */
export const reminderKinds = ['shipBy', 'balanceUnpaid', 'checkoutAbandoned', 'requestExpiry'] as const;
export type ReminderKind = (typeof reminderKinds)[number];

/** The largest figure each setting takes, and its unit. */
export const reminderLimits = {
  shipBy: { field: 'daysBefore', min: 1, max: 30, unit: 'days' },
  balanceUnpaid: { field: 'daysAfterReady', min: 1, max: 90, unit: 'days' },
  checkoutAbandoned: { field: 'hoursAfter', min: 1, max: 168, unit: 'hours' },
  requestExpiry: { field: 'daysUnpaid', min: 1, max: 365, unit: 'days' },
} as const satisfies Record<ReminderKind, { field: string; min: number; max: number; unit: string }>;

const whole = (field: string, min: number, max: number, unit: string) =>
  z
    .number({ error: rules.numberFromTo(label(field), min, max, unit, true) })
    .int({ error: rules.numberFromTo(label(field), min, max, unit, true) })
    .min(min, { error: rules.numberFromTo(label(field), min, max, unit, true) })
    .max(max, { error: rules.numberFromTo(label(field), min, max, unit, true) });

const settingOf = (kind: ReminderKind) => {
  const { field, min, max, unit } = reminderLimits[kind];
  return whole(field, min, max, unit).optional();
};

const nonEmpty = (_kind: ReminderKind) => (body: Record<string, unknown>) => Object.values(body).some((value) => value !== undefined);
const groupEmpty = (kind: ReminderKind) => ({ error: reminderWords.groupEmpty(reminderWords.kinds[kind]) });

const shipBy = requestObject({ enabled: flag('enabled').optional(), daysBefore: settingOf('shipBy') }).refine(
  nonEmpty('shipBy'),
  groupEmpty('shipBy'),
);
const balanceUnpaid = requestObject({ enabled: flag('enabled').optional(), daysAfterReady: settingOf('balanceUnpaid') }).refine(
  nonEmpty('balanceUnpaid'),
  groupEmpty('balanceUnpaid'),
);
const checkoutAbandoned = requestObject({ enabled: flag('enabled').optional(), hoursAfter: settingOf('checkoutAbandoned') }).refine(
  nonEmpty('checkoutAbandoned'),
  groupEmpty('checkoutAbandoned'),
);
const requestExpiry = requestObject({ enabled: flag('enabled').optional(), daysUnpaid: settingOf('requestExpiry') }).refine(
  nonEmpty('requestExpiry'),
  groupEmpty('requestExpiry'),
);

/** PATCH /api/settings/reminders: any reminder, any of its two settings. */
export const updateReminderSettingsSchema = requestObject({
  shipBy: shipBy.optional(),
  balanceUnpaid: balanceUnpaid.optional(),
  checkoutAbandoned: checkoutAbandoned.optional(),
  requestExpiry: requestExpiry.optional(),
}).refine((body) => Object.values(body).some((value) => value !== undefined), { error: reminderWords.settingsEmpty });
export type UpdateReminderSettingsInput = z.infer<typeof updateReminderSettingsSchema>;

/** GET /api/settings/reminders. */
export interface ReminderSettingsView {
  /** Remind the player and the build's builder when the ship-by day is this near and no tracking number is recorded. */
  shipBy: { enabled: boolean; daysBefore: number };
  /** Remind the player of an unpaid balance this many days after the board became ready. */
  balanceUnpaid: { enabled: boolean; daysAfterReady: number };
  /** Remind the player once of a checkout left unfinished this many hours. */
  checkoutAbandoned: { enabled: boolean; hoursAfter: number };
  /** Expire a request whose deposit is still unpaid this many days after it was made; the player is told. */
  requestExpiry: { enabled: boolean; daysUnpaid: number };
}

/**
 * The backoffice form: every reminder with its switch and its figure typed as text, checked by the
 * same whole-number rule as the API (so the form and a 400 say the same words).
 */
const typed = (kind: ReminderKind) => {
  const { field, min, max, unit } = reminderLimits[kind];
  return numberText(field, whole(field, min, max, unit));
};
export const reminderSettingsFormSchema = z.object({
  shipBy: z.object({ enabled: z.boolean(), daysBefore: typed('shipBy') }),
  balanceUnpaid: z.object({ enabled: z.boolean(), daysAfterReady: typed('balanceUnpaid') }),
  checkoutAbandoned: z.object({ enabled: z.boolean(), hoursAfter: typed('checkoutAbandoned') }),
  requestExpiry: z.object({ enabled: z.boolean(), daysUnpaid: typed('requestExpiry') }),
});
export type ReminderSettingsFormInput = z.input<typeof reminderSettingsFormSchema>;

import { z } from 'zod';
import { bookingStates } from './domain';
import { oneOf, requestObject } from './request-fields';

/**
 * A builder's today (GET /api/today): the builds on their bench today and the rest of this week
 * (Monday to Sunday in the shop's time zone), what each is waiting for, and the next thing to do.
 * A builder sees their own; the owner sees the whole shop, or only their own bench with `scope=mine`.
 */
export const todayScopes = ['mine', 'all'] as const;
export type TodayScope = (typeof todayScopes)[number];

export const todayQuerySchema = requestObject({ scope: oneOf('Whose builds', todayScopes).optional() });
export type TodayQuery = z.infer<typeof todayQuerySchema>;

/** What a build waits for before the next step: the player's parcel, the check-in, an answer, money, or hours to record. */
export const todayWaitKinds = ['parcel', 'intake', 'approval', 'balance', 'hours'] as const;
export type TodayWaitKind = (typeof todayWaitKinds)[number];

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/);
/** Hours as a decimal string with two decimals ("3.50"). */
const hours = z.string().regex(/^\d+\.\d{2}$/);

export const todayBuildSchema = z.object({
  bookingId: z.uuid(),
  reference: z.string(),
  customerName: z.string(),
  state: z.enum(bookingStates),
  builderId: z.uuid().nullable(),
  builderName: z.string().nullable(),
  /** 'today': bench hours today; 'week': bench hours on another day of this week; 'ready': built, waiting to go out. */
  when: z.enum(['today', 'week', 'ready']),
  /** The days of this week with bench hours for it, in order. */
  benchDays: z.array(z.object({ day, hours })),
  hoursToday: hours,
  recordedToday: hours,
  quotedHours: hours.nullable(),
  recordedHours: hours,
  waitingFor: z.array(z.object({ kind: z.enum(todayWaitKinds), words: z.string() })),
  nextAction: z.object({ words: z.string(), to: z.string() }),
});
export type TodayBuild = z.infer<typeof todayBuildSchema>;

export const todayResponseSchema = z.object({
  today: day,
  weekStart: day,
  weekEnd: day,
  scope: z.enum(todayScopes),
  /** Whether the signed-in person has a bench of their own (the owner may not). */
  hasOwnBench: z.boolean(),
  builds: z.array(todayBuildSchema),
});
export type TodayResponse = z.infer<typeof todayResponseSchema>;

import { z } from 'zod';
import { hourlyRateField } from './auth-schemas';
import { builderLevels } from './domain';
import { flag, hours, numberText, oneOf, requestObject } from './request-fields';
import { shopWords, weekdayNames } from './words';

export const WEEKDAY_KEYS = ['1', '2', '3', '4', '5', '6', '7'] as const;
type WeekdayKey = (typeof WEEKDAY_KEYS)[number];

/** Bench hours of one ISO weekday: 0 (a day off) to 24, in quarter hours or finer. */
const dayHours = (day: WeekdayKey) => {
  const words = shopWords.dayHours(weekdayNames[day]);
  return hours(`${weekdayNames[day]} hours`, { min: 0, max: 24, minWords: words });
};

/** A week of bench hours keyed by ISO 8601 weekday number, "1" = Monday … "7" = Sunday. */
export const weeklyHoursField = z.strictObject(
  Object.fromEntries(WEEKDAY_KEYS.map((day) => [day, dayHours(day).optional()])) as Record<
    WeekdayKey,
    z.ZodOptional<ReturnType<typeof dayHours>>
  >,
  {
    error: (issue) => (issue.code === 'unrecognized_keys' ? shopWords.unknownWeekdays(issue.keys) : shopWords.weeklyHoursNotAnObject),
  },
);

/** PATCH /api/team/:builderId: any of level, rate, week and availability. */
export const updateTeamMemberSchema = requestObject({
  level: oneOf('level', builderLevels).optional(),
  hourlyRate: hourlyRateField.optional(),
  weeklyHours: weeklyHoursField.optional(),
  active: flag('active').optional(),
}).refine((body) => Object.values(body).some((value) => value !== undefined), {
  error: shopWords.teamEmpty,
});
export type UpdateTeamMemberInput = z.infer<typeof updateTeamMemberSchema>;

/** The backoffice's form for a builder: the same rules, each day's hours typed as text (blank = a day off). */
export const teamMemberFormSchema = z.object({
  level: oneOf('level', builderLevels),
  hourlyRate: hourlyRateField,
  active: flag('active'),
  hours: z.object(
    Object.fromEntries(WEEKDAY_KEYS.map((day) => [day, numberText(`${weekdayNames[day]} hours`, dayHours(day), { blankAs: 0 })])) as Record<
      WeekdayKey,
      ReturnType<typeof numberText<ReturnType<typeof dayHours>>>
    >,
  ),
});
export type TeamMemberFormInput = z.input<typeof teamMemberFormSchema>;
export type TeamMemberFormOutput = z.output<typeof teamMemberFormSchema>;

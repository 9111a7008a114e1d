import { ValidateBy, type ValidationOptions } from 'class-validator';
import { isCalendarDay } from '../calendar-days';

/** A real calendar day written YYYY-MM-DD (2026-02-30 is refused). */
export function IsCalendarDay(options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    {
      name: 'isCalendarDay',
      validator: {
        validate: (value) => isCalendarDay(value),
        defaultMessage: (args) => `${args?.property} must be a calendar day written YYYY-MM-DD`,
      },
    },
    options,
  );
}

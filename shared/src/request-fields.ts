import Decimal from 'decimal.js';
import { z } from 'zod';
import { bookingWords, label, rules } from './words';

/**
 * Building blocks of the request schemas: each field says what is wrong in plain words that name
 * it by its label (`label(field)` from the words file: "workedOn" reads "Day worked"), so the
 * API's 400 and the form under the field read the same. Numbers are finite JSON numbers
 * (zod refuses NaN and ±Infinity), ids are UUIDs, days are real calendar days.
 */

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;

/** A real calendar day written YYYY-MM-DD (ISO 8601 calendar date; 2026-02-30 is refused). */
export function isCalendarDay(value: unknown): value is string {
  if (typeof value !== 'string' || !ISO_DAY.test(value)) return false;
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
}

/**
 * A request body or query: an object that takes only the fields listed. An unknown field is a
 * 400 naming it, as a typo should be (a misspelt optional field would otherwise be dropped).
 */
export const requestObject = <Shape extends z.ZodRawShape>(shape: Shape) =>
  z.strictObject(shape, {
    error: (issue) => (issue.code === 'unrecognized_keys' ? rules.unknownFields(issue.keys) : rules.notAnObject),
  });

interface TextRule {
  max: number;
  /** Fewest characters after trimming (default 0: may be empty). */
  min?: number;
  /** Said when the text is shorter than `min`. */
  tooShort?: string;
}

/** Text, trimmed, within a length; the words name the field. */
export const text = (field: string, { max, min = 0, tooShort }: TextRule) => {
  const l = label(field);
  const short = tooShort ?? (min > 1 ? rules.tooShort(l, min) : rules.required(l));
  const base = z
    .string({ error: (issue) => (issue.input === undefined && min > 0 ? short : rules.text(l)) })
    .trim()
    .max(max, { error: rules.tooLong(l, max) });
  return min > 0 ? base.min(min, { error: short }) : base;
};

/** An id of a row (a UUID as PostgreSQL writes it), e.g. `uuid('builderId', 'a builder')`. */
export const uuid = (_field: string, what: string) => z.guid({ error: rules.id(what) });

export const calendarDay = (field: string) =>
  z.string({ error: rules.day(label(field)) }).refine(isCalendarDay, { error: rules.day(label(field)) });

/**
 * A positive amount of money as a decimal string with at most two decimals and `digits` digits
 * before the point ("45.00", "95"); never a JSON number, so no binary rounding on the way in.
 */
export const positiveAmount = (field: string, digits: number, example: string, words = rules.amount(label(field), example)) => {
  return z
    .string({ error: words })
    .trim()
    .regex(new RegExp(`^\\d{1,${digits}}(\\.\\d{1,2})?$`), { error: words, abort: true })
    .refine((value) => new Decimal(value).gt(0), { error: words });
};

export const flag = (field: string) => z.boolean({ error: rules.yesNo(label(field)) });

/** A value from a fixed list; the words list every choice. */
export const oneOf = <const Values extends readonly [string, ...string[]]>(field: string, values: Values) =>
  z.enum(values, { error: rules.oneOf(label(field), values) });

/**
 * A finite number of hours from `min` to `max` with at most two decimals (a quarter hour is
 * 0.25; 2.3 is fine). Decimal reads the number by its shortest decimal form, so 2.3 counts as
 * two decimals although 2.3 × 100 is not a whole number in binary floating point.
 */
export const hours = (
  field: string,
  { min, max, minWords, maxWords = minWords }: { min: number; max: number; minWords: string; maxWords?: string },
) =>
  z
    .number({ error: rules.hours(label(field)) })
    .min(min, { error: minWords, abort: true })
    .max(max, { error: maxWords, abort: true })
    .refine((value) => new Decimal(value).times(100).isInteger(), { error: rules.hoursDecimals(label(field)) });

/**
 * A form field typed as text that holds a number: trimmed, written with digits and an optional
 * decimal point, then checked by the same number rule the API uses. With `blankAs`, an empty
 * field stands for that number (a day off is 0 hours).
 */
export const numberText = <Out extends z.ZodType<number, number>>(field: string, rule: Out, { blankAs }: { blankAs?: number } = {}) =>
  z
    .string()
    .trim()
    .regex(blankAs === undefined ? /^\d+(\.\d+)?$/ : /^(\d+(\.\d+)?)?$/, { error: rules.number(label(field)) })
    .transform((value) => (value === '' && blankAs !== undefined ? blankAs : Number(value)))
    .pipe(rule);

/** A whole number in a query string ("?page=2"), read from its text. */
export const wholeNumberQuery = (field: string, min: number, max: number) =>
  z.coerce
    .number({ error: rules.wholeNumber(label(field)) })
    .int({ error: rules.wholeNumber(label(field)) })
    .min(min, { error: rules.atLeast(label(field), min) })
    .max(max, { error: rules.atMost(label(field), max) });

/** Paging of every list: page from 1, at most 100 rows a page. */
export const pagingQuery = {
  page: wholeNumberQuery('page', 1, 100_000).default(1),
  pageSize: wholeNumberQuery('pageSize', 1, 100).default(25),
};

/**
 * The previous page's `nextCursor` on a list read through its sort's index (`page` is then not
 * used), read back by the list's own `decode`: a damaged or foreign cursor is a 400 in words.
 */
export const pageCursor = <Cursor>(decode: (value: string) => Cursor | null) =>
  z
    .string({ error: bookingWords.listCursor })
    .max(400, { error: bookingWords.listCursor })
    .transform((value, ctx) => {
      const cursor = decode(value);
      if (!cursor) {
        ctx.addIssue({ code: 'custom', message: bookingWords.listCursor });
        return z.NEVER;
      }
      return cursor;
    });

export const sortOrder = (fallback: 'asc' | 'desc') => oneOf('order', ['asc', 'desc']).default(fallback);

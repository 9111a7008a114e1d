import { z } from 'zod';
import { en, label, rules } from './en';

/** The words of the product's one language today; another language would be chosen here. */
export const words = en;
export * from './en';

/** The last named field of an issue's path ("hours" of ['entries', 2, 'hours']), as words. */
function fieldOf(path: ReadonlyArray<PropertyKey> | undefined): string | undefined {
  const key = [...(path ?? [])].reverse().find((k) => typeof k === 'string');
  return typeof key === 'string' ? label(key) : undefined;
}

type ZodIssue = z.core.$ZodRawIssue;

/**
 * zod's locale for every check that has no message of its own: plain sentences that name the
 * field by its label, never zod's developer wording ("Invalid input: expected string").
 */
export function plainZodError(issue: ZodIssue): string {
  const l = fieldOf(issue.path) ?? 'This value';
  switch (issue.code) {
    case 'invalid_type':
      if (!issue.path?.length && issue.expected === 'object') return rules.notAnObject;
      if (issue.input === undefined) return rules.required(l);
      if (issue.expected === 'string') return rules.text(l);
      if (issue.expected === 'number' || issue.expected === 'int') return rules.number(l);
      if (issue.expected === 'boolean') return rules.yesNo(l);
      if (issue.expected === 'array') return rules.list(l);
      return rules.invalid(l);
    case 'too_big':
      if (issue.origin === 'string') return rules.tooLong(l, Number(issue.maximum));
      if (issue.origin === 'array' || issue.origin === 'set') return `${l} can list at most ${issue.maximum}`;
      return rules.atMost(l, Number(issue.maximum));
    case 'too_small':
      if (issue.origin === 'string') return Number(issue.minimum) <= 1 ? rules.required(l) : rules.tooShort(l, Number(issue.minimum));
      if (issue.origin === 'array' || issue.origin === 'set') return `${l} must list at least ${issue.minimum}`;
      return rules.atLeast(l, Number(issue.minimum));
    case 'invalid_value':
      return rules.oneOf(l, issue.values.map(String));
    case 'unrecognized_keys':
      return rules.unknownFields(issue.keys);
    case 'invalid_format':
      return issue.format === 'email' ? `${l}: enter an e-mail address, like name@example.com` : rules.invalid(l);
    case 'not_multiple_of':
      return `${l} must be a multiple of ${issue.divisor}`;
    default:
      return rules.invalid(l);
  }
}

z.config({ localeError: plainZodError });
export { jargonIn, jargonPatterns } from './jargon';

import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { hasErrorCode, isShopAwayError, isSignedOutError } from '../api-client';
import { benchDateErrorCodes } from '../error-codes';

/**
 * What the apps do about a refused or failed call, chosen by the answer's `code` (never by its
 * words, which are shown as they are):
 * - `fields`: the form's own fields are wrong (`validation_failed`); each message goes under its field;
 * - `pick-another-date`: the bench time went to another build (`bench_time_taken`), or the date cannot take the build
 *   (`bench_day_full`, `bench_day_closed`, `bench_date_in_past`, `too_soon_to_ship`);
 * - `sign-in-again`: the session ran out or was ended (`not_signed_in`, `session_ended`);
 * - `wait-and-retry`: too many attempts, or the shop not answering (`too_many_attempts`, `shop_unavailable`, `unreachable`);
 * - `link-expired`: a single-use link is unknown, used or expired (`link_invalid`);
 * - `other`: anything else; the server's sentence says what happened.
 */
export type ErrorAdviceKind = 'fields' | 'pick-another-date' | 'sign-in-again' | 'wait-and-retry' | 'link-expired' | 'other';

export function errorAdvice(error: unknown): ErrorAdviceKind {
  if (hasErrorCode(error, 'validation_failed')) return 'fields';
  if (benchDateErrorCodes.some((code) => hasErrorCode(error, code))) return 'pick-another-date';
  if (isSignedOutError(error)) return 'sign-in-again';
  if (hasErrorCode(error, 'too_many_attempts') || isShopAwayError(error)) return 'wait-and-retry';
  if (hasErrorCode(error, 'link_invalid')) return 'link-expired';
  return 'other';
}

/** react-hook-form's name for an API path: "outputs[2].volts" → "outputs.2.volts". */
export const formFieldName = (path: string) => path.replace(/\[(\d+)\]/g, '.$1');

/** Where the form's values sit in the request body: `from: 'book'` when the body is `{ book, notes }` and the form edits the book. */
export interface FieldErrorOptions {
  from?: string;
}

/**
 * The form field an issue's path names, among the form's `fields`: the field itself, or a field
 * under one of them (a listed `surfaces` takes "surfaces[2].price" as `surfaces.2.price`).
 */
const fieldOf = <T extends FieldValues>(path: string, fields: ReadonlyArray<Path<T>>, { from }: FieldErrorOptions = {}) => {
  const full = formFieldName(path);
  const name = from ? (full.startsWith(`${from}.`) ? full.slice(from.length + 1) : undefined) : full;
  if (name === undefined) return undefined;
  return fields.some((f) => name === f || name.startsWith(`${f}.`)) ? (name as Path<T>) : undefined;
};

/** True when the error is a `validation_failed` answer whose every problem names one of these form fields. */
export function fieldsCoverError<T extends FieldValues>(
  error: unknown,
  fields: ReadonlyArray<Path<T>>,
  options?: FieldErrorOptions,
): boolean {
  return (
    hasErrorCode(error, 'validation_failed') &&
    error.issues.length > 0 &&
    error.issues.every((i) => fieldOf(i.path, fields, options) !== undefined)
  );
}

/**
 * Puts each problem of a `validation_failed` answer under the form field it names (react-hook-form's
 * `setError`, type `server`), for the fields this form has; the first such field takes the focus.
 * Other codes set nothing. With `fieldsCoverError` the form leaves out the alert above it when
 * every problem found its field; otherwise it shows the server's words there too.
 */
export function setServerFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: ReadonlyArray<Path<T>>,
  options?: FieldErrorOptions,
): void {
  if (!hasErrorCode(error, 'validation_failed')) return;
  let first = true;
  for (const issue of error.issues) {
    const field = fieldOf(issue.path, fields, options);
    if (!field) continue;
    setError(field, { type: 'server', message: issue.message }, { shouldFocus: first });
    first = false;
  }
}

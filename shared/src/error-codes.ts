/**
 * Every `code` an error answer of the API can carry, each with what it means. The code is stable
 * (apps and scripts branch on it); the `message` beside it is written for people and may be reworded.
 * One list, so the same mistake has the same code on every route.
 */
export const ERROR_CODES = {
  // 400: the request itself is wrong
  validation_failed: 'A field of the body or query is missing or not written as the route expects; `details` names each.',
  invalid_id: 'An id in the address is not a UUID.',
  invalid_json: 'The body is not valid JSON.',
  body_not_object: 'The body is valid JSON but a bare string, number or null instead of an object.',
  body_unreadable: 'The body could not be read (for example a wrong character encoding).',
  body_too_deep: 'The body is nested deeper than any request here needs.',
  invalid_unicode: 'A text holds half of a surrogate pair, which is not valid Unicode.',
  value_not_storable: 'A value cannot be stored as given (a NUL byte, a number out of range, a malformed date).',
  current_password_wrong: 'The current password sent to change a password is not the account’s password.',
  link_invalid: 'A single-use link (password reset, invitation) is unknown, used or expired.',
  bench_date_in_past: 'The bench date asked for is before the shop’s today; pick a later date.',
  too_soon_to_ship: 'The bench date is too soon for the player’s pedals to arrive by post; pick a later date.',
  bad_request: 'The request cannot be carried out as sent; the message says why.',
  // 401, 403
  not_signed_in: 'The route needs a signed-in person and the request carries no valid session.',
  session_ended: 'The session was ended (signed out, signed out everywhere, or the password changed).',
  invalid_credentials: 'The e-mail and password do not match an account.',
  cross_site_request: 'A state-changing request came from another site and was refused.',
  role_not_allowed: 'The signed-in person’s role may not use this route.',
  forbidden: 'The signed-in person may not do this to this record; the message says why.',
  // 404
  not_found: 'The record named in the address does not exist, or is not the caller’s.',
  route_not_found: 'No route of the API answers this method and path.',
  // 409: the request is well formed, but the records are not in a state that allows it
  email_taken: 'An account with this e-mail address already exists.',
  bench_time_taken: 'The bench time was just taken by another build; pick another date.',
  bench_day_full: 'The bench date has no free hours left for this build (full, or short of the hours it needs); pick another date.',
  bench_day_closed:
    'The shop or the builder does not work on the bench date (a closure, a public holiday, a day off or an absence); pick another date.',
  too_late_to_cancel: 'The build has gone past the point where this cancellation is possible; the message says who to ask.',
  nothing_due: 'Nothing is owed on the booking now (already paid, waived, or not yet due), so there is nothing to pay, record or refund.',
  payment_settling: 'A bank payment is still settling; nothing more can be paid or refunded until it has.',
  deposit_disputed: 'The player’s bank disputes the payment; the money cannot move until the dispute closes.',
  conflict: 'The record is not in a state that allows this now; the message says what would.',
  // 413, 415, 429
  payload_too_large: 'The body is larger than the route accepts.',
  photo_too_large: 'The uploaded photo is larger than a booking photo may be.',
  unsupported_media_type: 'The body’s Content-Type is not one the route documents.',
  too_many_attempts: 'Too many attempts from this address or for this account; wait, then try again.',
  // 5xx: the shop's trouble, not the caller's
  internal_error: 'The server failed; nothing the caller sent is to blame.',
  payment_provider_error: 'The payment provider refused or did not answer.',
  shop_unavailable: 'The shop’s database is not answering; try again after Retry-After seconds.',
  price_book_missing: 'No price book has been published yet.',
} as const;

export type ErrorCode = keyof typeof ERROR_CODES;

/** Every refusal of a bench date (accepting or moving a build): the apps offer another date for each. */
export const benchDateErrorCodes = [
  'bench_date_in_past',
  'too_soon_to_ship',
  'bench_day_full',
  'bench_day_closed',
  'bench_time_taken',
] as const satisfies readonly ErrorCode[];
// Pure, so a bundle that reads only the codes' statuses (the apps' API client) leaves the descriptions out.
export const errorCodes = /* @__PURE__ */ Object.keys(ERROR_CODES) as [ErrorCode, ...ErrorCode[]];

/** The HTTP status each code is sent with (the grouping of ERROR_CODES above): what the API's OpenAPI document lists per route. */
export const ERROR_CODE_STATUS: Record<ErrorCode, number> = {
  validation_failed: 400,
  invalid_id: 400,
  invalid_json: 400,
  body_not_object: 400,
  body_unreadable: 400,
  body_too_deep: 400,
  invalid_unicode: 400,
  value_not_storable: 400,
  current_password_wrong: 400,
  link_invalid: 400,
  bench_date_in_past: 400,
  too_soon_to_ship: 400,
  bad_request: 400,
  not_signed_in: 401,
  session_ended: 401,
  invalid_credentials: 401,
  cross_site_request: 403,
  role_not_allowed: 403,
  forbidden: 403,
  not_found: 404,
  route_not_found: 404,
  email_taken: 409,
  bench_time_taken: 409,
  bench_day_full: 409,
  bench_day_closed: 409,
  too_late_to_cancel: 409,
  nothing_due: 409,
  payment_settling: 409,
  deposit_disputed: 409,
  conflict: 409,
  payload_too_large: 413,
  photo_too_large: 413,
  unsupported_media_type: 415,
  too_many_attempts: 429,
  internal_error: 500,
  payment_provider_error: 502,
  shop_unavailable: 503,
  price_book_missing: 503,
};

/** The code an error answer carries when the code that raised it named none: one per status. */
export function defaultErrorCode(status: number): ErrorCode {
  switch (status) {
    case 400:
      return 'bad_request';
    case 401:
      return 'not_signed_in';
    case 403:
      return 'forbidden';
    case 404:
      return 'not_found';
    case 409:
      return 'conflict';
    case 413:
      return 'payload_too_large';
    case 415:
      return 'unsupported_media_type';
    case 429:
      return 'too_many_attempts';
    case 502:
      return 'payment_provider_error';
    case 503:
      return 'shop_unavailable';
    default:
      return status >= 500 ? 'internal_error' : 'bad_request';
  }
}

/** `{ code, message }` for an HTTP exception's response, so a thrown error names its code. */
export const errorResponse = (code: ErrorCode, message: string) => ({ code, message });

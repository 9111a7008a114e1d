import type { AuthUser, BookingSummary } from '@loomwright/shared';
import type { NextFunction, Request, Response } from 'express';

/** A booking (summary or detail) as every route answers it: a reference, its customer and its builder. */
function isBooking(value: unknown): value is BookingSummary {
  if (!value || typeof value !== 'object') return false;
  const v = value as Partial<BookingSummary>;
  return typeof v.reference === 'string' && !!v.customer && typeof v.customer === 'object' && 'email' in v.customer && 'builder' in v;
}

/**
 * A builder sees the e-mail address of the customers whose builds are theirs, and of nobody else:
 * a request not yet accepted, or a colleague's build, shows the customer's name only (the owner
 * and the player see everything). The rule lives in one place for every route that answers a
 * booking, so no state change, note or move can hand an address back by another way.
 */
export function bookingAsSeenBy<T extends BookingSummary>(viewer: Pick<AuthUser, 'id' | 'role'>, booking: T): T {
  if (viewer.role !== 'builder' || booking.builder?.userId === viewer.id) return booking;
  return { ...booking, customer: { ...booking.customer, email: null } };
}

function redactFor(viewer: Pick<AuthUser, 'id' | 'role'>, value: unknown): unknown {
  if (isBooking(value)) return bookingAsSeenBy(viewer, value);
  if (Array.isArray(value)) return value.map((v) => redactFor(viewer, v));
  if (value && typeof value === 'object' && Array.isArray((value as { items?: unknown }).items)) {
    return { ...value, items: (value as { items: unknown[] }).items.map((v) => redactFor(viewer, v)) };
  }
  return value;
}

/**
 * Applies `bookingAsSeenBy` to any JSON answer of any route that is a booking, a list of bookings
 * or a page of them, when a builder asked (configureApp mounts it for the whole app). It wraps
 * `res.json`, which Nest's Express adapter calls with a route's answer; by then the sign-in guard
 * has put the person on `req.user`. An Express middleware, not a Nest interceptor: any global interceptor puts
 * every route, the anonymous estimate included, through Nest's RxJS chain, which measured about a
 * sixth of that route's CPU time (DEVELOPERS.md, "Speed at scale").
 */
export function customerContactMiddleware(req: Request, res: Response, next: NextFunction): void {
  const json = res.json;
  res.json = function (this: Response, body?: unknown) {
    const viewer = req.user as AuthUser | undefined;
    return json.call(this, viewer?.role === 'builder' ? redactFor(viewer, body) : body);
  };
  next();
}

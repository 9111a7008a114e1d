import { CallHandler, ExecutionContext, Injectable, NestInterceptor } from '@nestjs/common';
import type { AuthUser, BookingSummary } from '@loomwright/shared';
import type { Request } from 'express';
import { map, type Observable } from 'rxjs';

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

/** Applies `bookingAsSeenBy` to any answer that is a booking, a list of bookings or a page of them. */
@Injectable()
export class CustomerContactInterceptor implements NestInterceptor {
  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    const viewer = context.getType() === 'http' ? (context.switchToHttp().getRequest<Request>().user as AuthUser | undefined) : undefined;
    if (viewer?.role !== 'builder') return next.handle();
    const redact = (value: unknown): unknown => {
      if (isBooking(value)) return bookingAsSeenBy(viewer, value);
      if (Array.isArray(value)) return value.map(redact);
      if (value && typeof value === 'object' && Array.isArray((value as { items?: unknown }).items)) {
        return { ...value, items: (value as { items: unknown[] }).items.map(redact) };
      }
      return value;
    };
    return next.handle().pipe(map(redact));
  }
}

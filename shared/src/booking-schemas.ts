import { z } from 'zod';
import { depositStatuses } from './booking-types';
import { bookingStates } from './domain';
import { rigConfigurationSchema } from './estimate/schema';
import { decodeCursorParts, encodeCursorParts, timestampKeyShape, uuidShape } from './list-cursor';
import { oneOf, pageCursor, pagingQuery, requestObject, sortOrder, text } from './request-fields';
import { bookingWords } from './words';

/** POST /api/bookings/:id/shipment: the parcel carrying the player's pedals to the shop. */
export const shipmentSchema = requestObject({
  carrier: text('carrier', { max: 100, min: 1, tooShort: bookingWords.carrier }),
  tracking: text('tracking', { max: 100, min: 1, tooShort: bookingWords.tracking }),
});
export type ShipmentInput = z.infer<typeof shipmentSchema>;

/** POST /api/bookings/:id/dispute/release: the owner lets a disputed build be delivered, saying why. */
export const releaseDisputeSchema = requestObject({
  note: text('note', { max: 1000, min: 1, tooShort: bookingWords.releaseNote }),
});
export type ReleaseDisputeInput = z.infer<typeof releaseDisputeSchema>;

/** The notes a player adds to a build request. */
export const requestNotesSchema = z.object({
  notes: text('notes', { max: 4000 }),
});
export type RequestNotesInput = z.infer<typeof requestNotesSchema>;

/** Photos the API accepts (checked again on the server by the file's bytes). */
export const PHOTO_MAX_BYTES = 8 * 1024 * 1024;
export const PHOTO_MAX_PER_BOOKING = 8;
export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;

/** POST /api/bookings: the configuration as POST /api/estimates takes it (re-priced on the server) and the player's notes. */
export const createBookingSchema = requestObject({
  configuration: rigConfigurationSchema,
  notes: requestNotesSchema.shape.notes.optional(),
});
export type CreateBookingInput = z.infer<typeof createBookingSchema>;

export const bookingSortColumns = ['created_at', 'updated_at', 'reference', 'state', 'bench_date'] as const;

/**
 * Where the next page of GET /api/bookings starts (keyset paging): the list's sort and order, and
 * the last row's sort value as PostgreSQL writes it (null for a build with no bench date) and id.
 * Travels as `cursor`, base64url of a small JSON array, so a link or a script can carry it as is.
 */
export interface BookingListCursor {
  sort: (typeof bookingSortColumns)[number];
  order: 'asc' | 'desc';
  key: string | null;
  id: string;
}

const cursorKeyShapes: Record<BookingListCursor['sort'], RegExp> = {
  created_at: timestampKeyShape,
  updated_at: timestampKeyShape,
  bench_date: /^\d{4}-\d{2}-\d{2}$/,
  reference: /^.{1,40}$/,
  state: new RegExp(`^(${bookingStates.join('|')})$`),
};

export const encodeBookingListCursor = (c: BookingListCursor): string => encodeCursorParts([c.sort, c.order, c.key, c.id]);

/** The cursor, or null when it is not one this list wrote (damaged, or from another version). */
export function decodeBookingListCursor(value: string): BookingListCursor | null {
  const parsed = decodeCursorParts(value);
  if (!parsed || parsed.length !== 4) return null;
  const [sort, order, key, id] = parsed as unknown[];
  if (typeof sort !== 'string' || !Object.hasOwn(cursorKeyShapes, sort)) return null;
  if (order !== 'asc' && order !== 'desc') return null;
  if (typeof id !== 'string' || !uuidShape.test(id)) return null;
  const column = sort as BookingListCursor['sort'];
  if (key === null ? column !== 'bench_date' : typeof key !== 'string' || !cursorKeyShapes[column].test(key)) return null;
  return { sort: column, order, key: key as string | null, id };
}

/** GET /api/bookings: a page of bookings, filtered and sorted. */
export const listBookingsQuerySchema = requestObject({
  ...pagingQuery,
  sort: oneOf('sort', bookingSortColumns).default('created_at'),
  order: sortOrder('desc'),
  state: oneOf('state', bookingStates).optional(),
  deposit: oneOf('deposit', depositStatuses).optional(),
  /** Part of the reference, the customer's name or e-mail. */
  q: text('q', { max: 200 }).optional(),
  /** The previous page's `nextCursor`: the page after it, found through the sort's index (`page` is then not used). */
  cursor: pageCursor(decodeBookingListCursor).optional(),
}).refine((q) => !q.cursor || (q.cursor.sort === q.sort && q.cursor.order === q.order), {
  error: bookingWords.listCursorOtherOrder,
  path: ['cursor'],
});
export type ListBookingsQuery = z.infer<typeof listBookingsQuerySchema>;

/** POST /api/bookings/:id/cancel: the player's reason, shown to the shop. */
export const cancelBookingSchema = requestObject({ reason: text('reason', { max: 1000 }).optional() });
export type CancelBookingInput = z.infer<typeof cancelBookingSchema>;

/** POST /api/bookings/:id/refund: why the deposit goes back (on the timeline and in the e-mail). */
export const refundDepositSchema = requestObject({
  reason: text('reason', { max: 1000, min: 1, tooShort: bookingWords.refundReason }),
});
export type RefundDepositInput = z.infer<typeof refundDepositSchema>;

export const photoKinds = ['intake', 'build'] as const;

/** The text fields that may travel beside the multipart `file` of POST /api/bookings/:id/photos. */
export const photoFieldsSchema = requestObject({
  caption: text('caption', { max: 200 }).optional(),
  /** Staff only: an intake or a build photo. */
  kind: oneOf('kind', photoKinds).optional(),
});
export type PhotoFieldsInput = z.infer<typeof photoFieldsSchema>;

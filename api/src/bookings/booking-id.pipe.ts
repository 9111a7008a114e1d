import { uuidParam } from '../common/uuid-param.pipe';

/** Route ids are UUIDs; anything else is the caller's mistake, answered in words. */
export const bookingIdPipe = uuidParam('id: a booking id is a UUID, as GET /api/bookings lists them.');
export const photoIdPipe = uuidParam('photoId: a photo id is a UUID, as the booking lists them.');

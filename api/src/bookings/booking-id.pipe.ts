import { BadRequestException, ParseUUIDPipe } from '@nestjs/common';

/** Route ids are UUIDs; anything else is the caller's mistake, answered in words. */
export const bookingIdPipe = new ParseUUIDPipe({
  exceptionFactory: () => new BadRequestException('id: a booking id is a UUID, as GET /api/bookings lists them.'),
});
export const photoIdPipe = new ParseUUIDPipe({
  exceptionFactory: () => new BadRequestException('photoId: a photo id is a UUID, as the booking lists them.'),
});

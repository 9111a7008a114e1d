import type { BookingListQuery } from './list-bookings';

/** Every booking query lives under ['bookings']; a change to any build invalidates `all`. */
export const bookingKeys = {
  all: ['bookings'] as const,
  lists: () => [...bookingKeys.all, 'list'] as const,
  list: (query: BookingListQuery) => [...bookingKeys.lists(), query] as const,
  detail: (id: string) => [...bookingKeys.all, 'detail', id] as const,
};

/** Every booking query lives under ['bookings']; mutations invalidate by these keys. */
export const bookingKeys = {
  all: ['bookings'] as const,
  lists: () => ['bookings', 'list'] as const,
  list: (params: { page: number; pageSize: number }) => ['bookings', 'list', params] as const,
  detail: (id: string) => ['bookings', 'detail', id] as const,
};

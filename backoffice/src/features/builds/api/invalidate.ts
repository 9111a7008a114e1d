import type { QueryClient } from '@tanstack/react-query';

/** Anything that moves a build changes its detail, every list it is in, and the bench. */
export const invalidateBuild = (queryClient: QueryClient, bookingId: string) =>
  Promise.all([
    queryClient.invalidateQueries({ queryKey: ['bookings'] }),
    queryClient.invalidateQueries({ queryKey: ['builds', bookingId] }),
    queryClient.invalidateQueries({ queryKey: ['bench'] }),
  ]);

import type { QueryClient } from '@tanstack/react-query';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { bookingKeys } from 'src/features/bookings/api/query-keys';
import { buildKeys } from './query-keys';

/** Anything that moves a build changes its detail, every list it is in, and the bench. */
export const invalidateBuild = (queryClient: QueryClient, bookingId: string) =>
  Promise.all([
    queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
    queryClient.invalidateQueries({ queryKey: buildKeys.build(bookingId) }),
    queryClient.invalidateQueries({ queryKey: benchKeys.all }),
  ]);

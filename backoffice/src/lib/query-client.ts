import { QueryClient } from '@tanstack/react-query';
import { ApiError } from '@loomwright/shared';

export function createQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // A 4xx will not change on retry; only network trouble and 5xx are worth another try.
        retry: (count, error) => count < 2 && !(error instanceof ApiError && error.status >= 400 && error.status < 500),
      },
    },
  });
}

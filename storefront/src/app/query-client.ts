import { createQueryClient } from 'src/lib/query-client';

/** The storefront's one query client: the providers hand it to React, route loaders warm it. */
export const queryClient = createQueryClient();

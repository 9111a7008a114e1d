import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Catalog } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getCatalog = (signal?: AbortSignal) => api.get<Catalog>('/catalog', { signal });

/** The catalog's query keys: one definition, used by every feature that reads the catalog. */
export const catalogKeys = { all: ['catalog'] as const };

export const catalogQueryOptions = () =>
  queryOptions({ queryKey: catalogKeys.all, queryFn: ({ signal }) => getCatalog(signal), staleTime: 5 * 60_000 });

export const useCatalog = () => useQuery(catalogQueryOptions());

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Catalog } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { catalogKeys } from './query-keys';

export const getCatalog = (signal?: AbortSignal) => api.get<Catalog>('/catalog', { signal });

export const catalogQueryOptions = () =>
  queryOptions({ queryKey: catalogKeys.all, queryFn: ({ signal }) => getCatalog(signal), staleTime: 5 * 60_000 });

export const useCatalog = () => useQuery(catalogQueryOptions());

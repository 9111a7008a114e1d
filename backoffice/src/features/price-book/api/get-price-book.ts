import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PriceBookOverview } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { priceBookKeys } from './query-keys';

export const getPriceBook = (signal?: AbortSignal) => api.get<PriceBookOverview>('/price-book', { signal });

export const priceBookQueryOptions = () =>
  queryOptions({ queryKey: priceBookKeys.current(), queryFn: ({ signal }) => getPriceBook(signal) });

export const usePriceBook = () => useQuery(priceBookQueryOptions());

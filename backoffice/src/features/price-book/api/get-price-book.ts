import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PriceBookOverview } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getPriceBook = (signal?: AbortSignal) => api.get<PriceBookOverview>('/price-book', { signal });

export const priceBookQueryOptions = () => queryOptions({ queryKey: ['price-book'], queryFn: ({ signal }) => getPriceBook(signal) });

export const usePriceBook = () => useQuery(priceBookQueryOptions());

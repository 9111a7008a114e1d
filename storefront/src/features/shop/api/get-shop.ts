import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopProfile } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getShop = (signal?: AbortSignal) => api.get<ShopProfile>('/shop', { signal });

export const shopQueryOptions = () => queryOptions({ queryKey: ['shop'], queryFn: ({ signal }) => getShop(signal), staleTime: 5 * 60_000 });

export const useShop = () => useQuery(shopQueryOptions());

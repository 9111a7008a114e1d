import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopProfile } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { shopKeys } from './query-keys';

export const getShop = (signal?: AbortSignal) => api.get<ShopProfile>('/shop', { signal });

export const shopQueryOptions = () =>
  queryOptions({ queryKey: shopKeys.profile(), queryFn: ({ signal }) => getShop(signal), staleTime: 5 * 60_000 });

export const useShop = () => useQuery(shopQueryOptions());

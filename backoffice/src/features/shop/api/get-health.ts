import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HealthStatus } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { shopKeys } from './query-keys';

export const getHealth = (signal?: AbortSignal) => api.get<HealthStatus>('/health', { signal });

export const healthQueryOptions = () =>
  queryOptions({ queryKey: shopKeys.health(), queryFn: ({ signal }) => getHealth(signal), refetchInterval: 30_000 });

export const useHealth = () => useQuery(healthQueryOptions());

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExtraView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { buildKeys } from './query-keys';

export const getExtras = (id: string, signal?: AbortSignal) =>
  api.get<ExtraView[]>(`/bookings/${encodeURIComponent(id)}/extras`, { signal });

export const extrasQueryOptions = (id: string) =>
  queryOptions({ queryKey: buildKeys.extras(id), queryFn: ({ signal }) => getExtras(id, signal) });

export const useExtras = (id: string) => useQuery(extrasQueryOptions(id));

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TimeEntriesResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { buildKeys } from './query-keys';

export const getTimeEntries = (id: string, signal?: AbortSignal) =>
  api.get<TimeEntriesResponse>(`/bookings/${encodeURIComponent(id)}/time-entries`, { signal });

export const timeEntriesQueryOptions = (id: string) =>
  queryOptions({ queryKey: buildKeys.timeEntries(id), queryFn: ({ signal }) => getTimeEntries(id, signal) });

export const useTimeEntries = (id: string) => useQuery(timeEntriesQueryOptions(id));

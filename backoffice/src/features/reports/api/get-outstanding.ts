import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutstandingReport } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { reportKeys } from './query-keys';

export const getOutstanding = (signal?: AbortSignal) => api.get<OutstandingReport>('/reports/outstanding', { signal });

export const outstandingQueryOptions = () =>
  queryOptions({ queryKey: reportKeys.outstanding(), queryFn: ({ signal }) => getOutstanding(signal) });

export const useOutstanding = () => useQuery(outstandingQueryOptions());

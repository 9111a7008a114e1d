import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutstandingReport } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getOutstanding = (signal?: AbortSignal) => api.get<OutstandingReport>('/reports/outstanding', { signal });

export const outstandingQueryOptions = () =>
  queryOptions({ queryKey: ['reports', 'outstanding'], queryFn: ({ signal }) => getOutstanding(signal) });

export const useOutstanding = () => useQuery(outstandingQueryOptions());

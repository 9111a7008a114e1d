import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { MailLogPage, MailLogQuery } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { mailLogKeys } from './query-keys';

export const getMailLog = (query: MailLogQuery, signal?: AbortSignal) => api.get<MailLogPage>('/mail', { query: { ...query }, signal });

export const mailLogQueryOptions = (query: MailLogQuery) =>
  queryOptions({
    queryKey: mailLogKeys.list(query),
    queryFn: ({ signal }) => getMailLog(query, signal),
    placeholderData: keepPreviousData,
    // Messages move from queued to sent within seconds; keep the log current while it is open.
    refetchInterval: 10_000,
  });

export const useMailLog = (query: MailLogQuery) => useQuery(mailLogQueryOptions(query));

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PersonSessions } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { sessionKeys } from './query-keys';

export const getSessions = (userId: string, signal?: AbortSignal) =>
  api.get<PersonSessions>(`/users/${encodeURIComponent(userId)}/sessions`, { signal });

export const sessionsQueryOptions = (userId: string) =>
  queryOptions({ queryKey: sessionKeys.person(userId), queryFn: ({ signal }) => getSessions(userId, signal) });

/** Where a person is signed in now (owner only); off until `enabled`, so a closed dialog asks nothing. */
export const useSessions = (userId: string, enabled: boolean) => useQuery({ ...sessionsQueryOptions(userId), enabled });

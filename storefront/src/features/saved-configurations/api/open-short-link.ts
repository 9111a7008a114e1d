import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RigConfiguration } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { configurationKeys } from './query-keys';

export const openShortLink = (code: string, signal?: AbortSignal) =>
  api.get<{ configuration: RigConfiguration }>(`/configuration-links/${encodeURIComponent(code)}`, { signal });

export const shortLinkQueryOptions = (code: string) =>
  queryOptions({
    queryKey: configurationKeys.link(code),
    queryFn: ({ signal }) => openShortLink(code, signal),
    retry: false,
    staleTime: Infinity,
  });

export const useShortLink = (code: string) => useQuery(shortLinkQueryOptions(code));

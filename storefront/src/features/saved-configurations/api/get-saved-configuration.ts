import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SavedConfiguration } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { configurationKeys } from './query-keys';

export const getSavedConfiguration = (id: string, signal?: AbortSignal) =>
  api.get<SavedConfiguration>(`/configurations/${encodeURIComponent(id)}`, { signal });

export const savedConfigurationQueryOptions = (id: string) =>
  queryOptions({ queryKey: configurationKeys.detail(id), queryFn: ({ signal }) => getSavedConfiguration(id, signal), retry: false });

/** The saved configuration the configurator is editing (`?saved=<id>`), when there is one and someone is signed in. */
export const useSavedConfiguration = (id: string | null, enabled: boolean) =>
  useQuery({ ...savedConfigurationQueryOptions(id ?? ''), enabled: enabled && !!id });

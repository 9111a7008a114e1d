import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SavedConfigurationSummary } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { configurationKeys } from './query-keys';

export const getSavedConfigurations = (signal?: AbortSignal) => api.get<SavedConfigurationSummary[]>('/configurations', { signal });

export const savedConfigurationsQueryOptions = () =>
  queryOptions({ queryKey: configurationKeys.list(), queryFn: ({ signal }) => getSavedConfigurations(signal) });

export const useSavedConfigurations = (enabled = true) => useQuery({ ...savedConfigurationsQueryOptions(), enabled });

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopSettingsView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { settingsKeys } from './query-keys';

export const getSettings = (signal?: AbortSignal) => api.get<ShopSettingsView>('/settings', { signal });

export const settingsQueryOptions = () => queryOptions({ queryKey: settingsKeys.shop(), queryFn: ({ signal }) => getSettings(signal) });

export const useSettings = () => useQuery(settingsQueryOptions());

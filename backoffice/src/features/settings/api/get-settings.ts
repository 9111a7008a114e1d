import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShopSettingsView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getSettings = (signal?: AbortSignal) => api.get<ShopSettingsView>('/settings', { signal });

export const settingsQueryOptions = () => queryOptions({ queryKey: ['settings'], queryFn: ({ signal }) => getSettings(signal) });

export const useSettings = () => useQuery(settingsQueryOptions());

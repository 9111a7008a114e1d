import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShopSettingsView, UpdateShopSettingsRequest } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { shopKeys } from 'src/features/shop/api/query-keys';
import { settingsKeys } from './query-keys';

export const updateSettings = (body: UpdateShopSettingsRequest) => api.request<ShopSettingsView>('/settings', { method: 'PATCH', body });

export const useUpdateSettings = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    // The country decides the holidays on the bench; the name shows in the navigation.
    onSuccess: () =>
      Promise.all([settingsKeys.all, benchKeys.all, shopKeys.all].map((queryKey) => queryClient.invalidateQueries({ queryKey }))),
  });
};

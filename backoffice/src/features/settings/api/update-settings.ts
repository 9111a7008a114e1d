import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShopSettingsView, UpdateShopSettingsRequest } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const updateSettings = (body: UpdateShopSettingsRequest) => api.request<ShopSettingsView>('/settings', { method: 'PATCH', body });

export const useUpdateSettings = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSettings,
    // The country decides the holidays on the bench; the name shows in the navigation.
    onSuccess: () => Promise.all(['settings', 'bench', 'shop'].map((key) => queryClient.invalidateQueries({ queryKey: [key] }))),
  });
};

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReminderSettingsView, UpdateReminderSettingsInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { settingsKeys } from './query-keys';

export const updateReminderSettings = (body: UpdateReminderSettingsInput) =>
  api.request<ReminderSettingsView>('/settings/reminders', { method: 'PATCH', body });

export const useUpdateReminderSettings = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateReminderSettings,
    onSuccess: (saved) => queryClient.setQueryData(settingsKeys.reminders(), saved),
  });
};

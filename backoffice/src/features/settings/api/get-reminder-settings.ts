import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReminderSettingsView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { settingsKeys } from './query-keys';

export const getReminderSettings = (signal?: AbortSignal) => api.get<ReminderSettingsView>('/settings/reminders', { signal });

export const reminderSettingsQueryOptions = () =>
  queryOptions({ queryKey: settingsKeys.reminders(), queryFn: ({ signal }) => getReminderSettings(signal) });

export const useReminderSettings = () => useQuery(reminderSettingsQueryOptions());

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HolidayChoiceInput, HolidayChoiceResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { settingsKeys } from './query-keys';

export const chooseHoliday = ({ day, ...body }: HolidayChoiceInput & { day: string }) =>
  api.request<HolidayChoiceResponse>(`/settings/holidays/${encodeURIComponent(day)}`, { method: 'PUT', body });

/** Opens the bench on one public holiday (the shop works) or closes it again. */
export const useChooseHoliday = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: chooseHoliday,
    // Bench capacity, suggestions and the storefront's lead time all follow the holiday.
    onSuccess: () => Promise.all([settingsKeys.all, benchKeys.all].map((queryKey) => queryClient.invalidateQueries({ queryKey }))),
  });
};

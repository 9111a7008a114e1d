import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CalendarFeedLink } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { calendarFeedKeys } from './query-keys';

/** Every feed link (owner only). */
export const useCalendarFeeds = (enabled: boolean) =>
  useQuery({
    queryKey: calendarFeedKeys.everyone(),
    queryFn: ({ signal }) => api.get<CalendarFeedLink[]>('/calendar-feeds', { signal }),
    enabled,
  });

/** The signed-in builder's own feed link. */
export const useMyCalendarFeed = () =>
  useQuery({
    queryKey: calendarFeedKeys.mine(),
    queryFn: ({ signal }) => api.get<CalendarFeedLink[]>('/calendar-feeds/mine', { signal }),
  });

export function useRotateCalendarFeed() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post<CalendarFeedLink>(`/calendar-feeds/${id}/rotate`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: calendarFeedKeys.all }),
  });
}

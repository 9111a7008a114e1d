/** Calendar feed links live under ['calendar-feeds']; rotating one invalidates `all`. */
export const calendarFeedKeys = {
  all: ['calendar-feeds'] as const,
  everyone: () => [...calendarFeedKeys.all, 'all'] as const,
  mine: () => [...calendarFeedKeys.all, 'mine'] as const,
};

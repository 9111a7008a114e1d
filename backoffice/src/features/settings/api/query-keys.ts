/** Shop settings (hours, closures, holidays) and reminder settings live under ['settings']. */
export const settingsKeys = {
  all: ['settings'] as const,
  shop: () => [...settingsKeys.all, 'shop'] as const,
  reminders: () => [...settingsKeys.all, 'reminders'] as const,
};

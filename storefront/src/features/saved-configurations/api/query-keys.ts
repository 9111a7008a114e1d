/** Every saved-configuration query lives under ['configurations']; mutations invalidate by these keys. */
export const configurationKeys = {
  all: ['configurations'] as const,
  list: () => ['configurations', 'list'] as const,
  detail: (id: string) => ['configurations', 'detail', id] as const,
  link: (code: string) => ['configuration-links', code] as const,
};

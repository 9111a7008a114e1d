import type { TodayScope } from '@loomwright/shared';

export const todayKeys = {
  all: ['today'] as const,
  scope: (scope: TodayScope | undefined) => [...todayKeys.all, scope ?? 'default'] as const,
};

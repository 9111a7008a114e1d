import type { BuilderLevel } from '@loomwright/shared';

export const benchKeys = {
  all: ['bench'] as const,
  leadTime: (hours: string | undefined, level: BuilderLevel | undefined) => [...benchKeys.all, 'lead-time', hours, level] as const,
};

import type { DateRangeQuery } from '@loomwright/shared';

export const reportKeys = {
  all: ['reports'] as const,
  outstanding: () => [...reportKeys.all, 'outstanding'] as const,
  utilisation: (range: DateRangeQuery) => [...reportKeys.all, 'utilisation', range] as const,
  hours: (range: DateRangeQuery) => [...reportKeys.all, 'hours', range] as const,
  revenue: (range: DateRangeQuery) => [...reportKeys.all, 'revenue', range] as const,
};

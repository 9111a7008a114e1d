import type { RevenueReport } from '@loomwright/shared';
import { reportKeys } from './query-keys';
import { rangeReport } from './range-report';

export const {
  get: getRevenue,
  options: revenueQueryOptions,
  useReport: useRevenue,
} = rangeReport<RevenueReport>('/reports/revenue', reportKeys.revenue);

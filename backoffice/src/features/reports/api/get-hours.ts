import type { HoursReport } from '@loomwright/shared';
import { reportKeys } from './query-keys';
import { rangeReport } from './range-report';

export const {
  get: getHoursReport,
  options: hoursQueryOptions,
  useReport: useHoursReport,
} = rangeReport<HoursReport>('/reports/hours', reportKeys.hours);

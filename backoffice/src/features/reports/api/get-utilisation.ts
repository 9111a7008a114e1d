import type { UtilisationReport } from '@loomwright/shared';
import { reportKeys } from './query-keys';
import { rangeReport } from './range-report';

export const {
  get: getUtilisation,
  options: utilisationQueryOptions,
  useReport: useUtilisation,
} = rangeReport<UtilisationReport>('/reports/utilisation', reportKeys.utilisation);

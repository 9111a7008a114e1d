import { queryOptions, useQuery } from '@tanstack/react-query';
import type { IntakeItemView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { buildKeys } from './query-keys';

export const getIntake = (id: string, signal?: AbortSignal) =>
  api.get<IntakeItemView[]>(`/bookings/${encodeURIComponent(id)}/intake`, { signal });

export const intakeQueryOptions = (id: string) =>
  queryOptions({ queryKey: buildKeys.intake(id), queryFn: ({ signal }) => getIntake(id, signal) });

export const useIntake = (id: string) => useQuery(intakeQueryOptions(id));

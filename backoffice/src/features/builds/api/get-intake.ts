import { queryOptions, useQuery } from '@tanstack/react-query';
import type { IntakeItemView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getIntake = (id: string, signal?: AbortSignal) =>
  api.get<IntakeItemView[]>(`/bookings/${encodeURIComponent(id)}/intake`, { signal });

export const intakeQueryOptions = (id: string) =>
  queryOptions({ queryKey: ['builds', id, 'intake'], queryFn: ({ signal }) => getIntake(id, signal) });

export const useIntake = (id: string) => useQuery(intakeQueryOptions(id));

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AbsenceInput, AddAbsenceResponse, BuilderAbsenceView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { teamKeys } from './query-keys';

export const getAbsences = (signal?: AbortSignal) => api.get<BuilderAbsenceView[]>('/team/absences', { signal });
export const absencesQueryOptions = () => queryOptions({ queryKey: teamKeys.absences(), queryFn: ({ signal }) => getAbsences(signal) });
export const useAbsences = () => useQuery(absencesQueryOptions());

export const addAbsence = ({ builderId, ...body }: AbsenceInput & { builderId: string }) =>
  api.post<AddAbsenceResponse>(`/team/${encodeURIComponent(builderId)}/absences`, body);

export const removeAbsence = (id: string) => api.request<void>(`/team/absences/${encodeURIComponent(id)}`, { method: 'DELETE' });

const invalidate = (queryClient: ReturnType<typeof useQueryClient>) =>
  Promise.all([teamKeys.all, benchKeys.all].map((queryKey) => queryClient.invalidateQueries({ queryKey })));

export const useAddAbsence = () => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: addAbsence, onSuccess: () => invalidate(queryClient) });
};

export const useRemoveAbsence = () => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: removeAbsence, onSuccess: () => invalidate(queryClient) });
};

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AbsenceInput, AddAbsenceResponse, BuilderAbsenceView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getAbsences = (signal?: AbortSignal) => api.get<BuilderAbsenceView[]>('/team/absences', { signal });
export const absencesQueryOptions = () => queryOptions({ queryKey: ['team', 'absences'], queryFn: ({ signal }) => getAbsences(signal) });
export const useAbsences = () => useQuery(absencesQueryOptions());

export const addAbsence = ({ builderId, ...body }: AbsenceInput & { builderId: string }) =>
  api.post<AddAbsenceResponse>(`/team/${encodeURIComponent(builderId)}/absences`, body);

export const removeAbsence = (id: string) => api.request<void>(`/team/absences/${encodeURIComponent(id)}`, { method: 'DELETE' });

const invalidate = (queryClient: ReturnType<typeof useQueryClient>) =>
  Promise.all(['team', 'bench'].map((key) => queryClient.invalidateQueries({ queryKey: [key] })));

export const useAddAbsence = () => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: addAbsence, onSuccess: () => invalidate(queryClient) });
};

export const useRemoveAbsence = () => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: removeAbsence, onSuccess: () => invalidate(queryClient) });
};

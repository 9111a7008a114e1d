import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TeamMember, UpdateTeamMemberRequest } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { teamKeys } from './query-keys';

export const updateTeamMember = (id: string, body: UpdateTeamMemberRequest) =>
  api.request<TeamMember>(`/team/${encodeURIComponent(id)}`, { method: 'PATCH', body });

export const useUpdateTeamMember = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: UpdateTeamMemberRequest }) => updateTeamMember(id, body),
    // Capacity feeds the bench; a new rate changes suggestions' firm totals.
    onSuccess: () => Promise.all([teamKeys.all, benchKeys.all].map((queryKey) => queryClient.invalidateQueries({ queryKey }))),
  });
};

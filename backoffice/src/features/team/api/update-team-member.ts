import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TeamMember, UpdateTeamMemberRequest } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const updateTeamMember = (id: string, body: UpdateTeamMemberRequest) =>
  api.request<TeamMember>(`/team/${encodeURIComponent(id)}`, { method: 'PATCH', body });

export const useUpdateTeamMember = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: UpdateTeamMemberRequest }) => updateTeamMember(id, body),
    // Capacity feeds the bench; a new rate changes suggestions' firm totals.
    onSuccess: () =>
      Promise.all([queryClient.invalidateQueries({ queryKey: ['team'] }), queryClient.invalidateQueries({ queryKey: ['bench'] })]),
  });
};

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TeamMember } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getTeam = (signal?: AbortSignal) => api.get<TeamMember[]>('/team', { signal });

export const teamQueryOptions = () => queryOptions({ queryKey: ['team'], queryFn: ({ signal }) => getTeam(signal) });

export const useTeam = () => useQuery(teamQueryOptions());

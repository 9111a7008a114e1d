import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TeamMember } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { teamKeys } from './query-keys';

export const getTeam = (signal?: AbortSignal) => api.get<TeamMember[]>('/team', { signal });

export const teamQueryOptions = () => queryOptions({ queryKey: teamKeys.members(), queryFn: ({ signal }) => getTeam(signal) });

export const useTeam = () => useQuery(teamQueryOptions());

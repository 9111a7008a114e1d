import { useQuery } from '@tanstack/react-query';
import type { BenchLeadTime, BuilderLevel } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from './query-keys';

/** The shop's next free bench date for a build of these hours at this level (nothing is reserved). */
export const getLeadTime = (hours: string, level: BuilderLevel, signal?: AbortSignal) =>
  api.get<BenchLeadTime>(`/bench/lead-time?${new URLSearchParams({ hours, level })}`, { signal });

export const useLeadTime = (hours: string | undefined, level: BuilderLevel | undefined) =>
  useQuery({
    queryKey: benchKeys.leadTime(hours, level),
    queryFn: ({ signal }) => getLeadTime(hours!, level!, signal),
    enabled: Boolean(hours && level),
    staleTime: 60_000,
  });

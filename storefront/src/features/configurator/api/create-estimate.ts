import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { EstimateResult, RigConfiguration } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const createEstimate = (configuration: RigConfiguration, signal?: AbortSignal) =>
  api.post<EstimateResult>('/estimates', configuration, { signal });

/**
 * An estimate is a pure answer to a configuration, so it is cached under the configuration's
 * encoded form (the same string the URL carries) and kept on screen while the next one loads.
 */
export const estimateQueryOptions = (encoded: string, configuration: RigConfiguration | undefined) =>
  queryOptions({
    queryKey: ['estimates', encoded],
    queryFn: ({ signal }) => createEstimate(configuration!, signal),
    enabled: configuration !== undefined,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

export const useEstimate = (encoded: string, configuration: RigConfiguration | undefined) =>
  useQuery(estimateQueryOptions(encoded, configuration));

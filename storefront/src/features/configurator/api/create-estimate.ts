import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { EstimatePanel, EstimateView, RigConfiguration } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { estimateKeys } from './query-keys';

export const createEstimate = (configuration: Partial<RigConfiguration>, view: EstimateView, signal?: AbortSignal) =>
  api.post<EstimatePanel>(`/estimates?view=${view}`, configuration, { signal });

/**
 * An estimate is cached under the configuration's encoded form (see estimateKeys) and kept on
 * screen while the next one loads.
 * While the player edits, the panel's share is enough (`view=panel`, about half the bytes); the
 * Review step asks for the whole answer, which carries the cable and power-lead lists it prints.
 */
export const estimateQueryOptions = (encoded: string, configuration: Partial<RigConfiguration> | undefined, view: EstimateView) =>
  queryOptions({
    queryKey: estimateKeys.answer(encoded, view),
    queryFn: ({ signal }) => createEstimate(configuration!, view, signal),
    enabled: configuration !== undefined,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

export const useEstimate = (encoded: string, configuration: Partial<RigConfiguration> | undefined, view: EstimateView) =>
  useQuery(estimateQueryOptions(encoded, configuration, view));

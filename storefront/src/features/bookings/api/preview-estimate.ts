import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EstimateResult, RigConfiguration } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

/** What the server would charge for this configuration now (the booking re-prices it again). */
export const previewEstimate = (configuration: Partial<RigConfiguration>, signal?: AbortSignal) =>
  api.post<EstimateResult>('/estimates', configuration, { signal });

export const estimatePreviewOptions = (encoded: string, configuration: Partial<RigConfiguration> | undefined) =>
  queryOptions({
    queryKey: ['estimates', encoded],
    queryFn: ({ signal }) => previewEstimate(configuration!, signal),
    enabled: configuration !== undefined,
  });

export const useEstimatePreview = (encoded: string, configuration: Partial<RigConfiguration> | undefined) =>
  useQuery(estimatePreviewOptions(encoded, configuration));

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PriceBookVersionSummary, PublishPriceBookRequest } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { priceBookKeys } from './query-keys';

export const publishPriceBook = (body: PublishPriceBookRequest) => api.post<PriceBookVersionSummary>('/price-book', body);

export const usePublishPriceBook = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: publishPriceBook,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: priceBookKeys.all }),
  });
};

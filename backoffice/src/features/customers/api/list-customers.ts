import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CustomerPage } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { customerKeys } from './query-keys';

export type CustomerSort = 'name' | 'email' | 'createdAt' | 'buildCount' | 'lastBookingAt';

export interface CustomerListQuery {
  page: number;
  pageSize: number;
  sort: CustomerSort;
  order: 'asc' | 'desc';
  search?: string;
}

export const listCustomers = (query: CustomerListQuery, signal?: AbortSignal) =>
  api.get<CustomerPage>('/customers', { query: { ...query }, signal });

export const customersQueryOptions = (query: CustomerListQuery) =>
  queryOptions({
    queryKey: customerKeys.list(query),
    queryFn: ({ signal }) => listCustomers(query, signal),
    placeholderData: keepPreviousData,
  });

export const useCustomers = (query: CustomerListQuery) => useQuery(customersQueryOptions(query));

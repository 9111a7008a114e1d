import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CustomerDetail } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { customerKeys } from './query-keys';

export const getCustomer = (id: string, signal?: AbortSignal) =>
  api.get<CustomerDetail>(`/customers/${encodeURIComponent(id)}`, { signal });

export const customerQueryOptions = (id: string) =>
  queryOptions({ queryKey: customerKeys.detail(id), queryFn: ({ signal }) => getCustomer(id, signal) });

export const useCustomer = (id: string | null) => useQuery({ ...customerQueryOptions(id ?? ''), enabled: Boolean(id) });

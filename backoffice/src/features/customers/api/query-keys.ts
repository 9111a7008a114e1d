import type { CustomerListQuery } from './list-customers';

export const customerKeys = {
  all: ['customers'] as const,
  list: (query: CustomerListQuery) => [...customerKeys.all, 'list', query] as const,
  detail: (id: string) => [...customerKeys.all, 'detail', id] as const,
};

import { useQuery } from '@tanstack/react-query';
import { catalogQueryOptions } from 'src/features/configurator/api/get-catalog';

/** The deposit policy is part of the catalog: the one catalog query, with a select, so the configurator's copy is reused. */
export const useDepositPolicy = () => useQuery({ ...catalogQueryOptions(), select: (catalog) => catalog.depositPolicy });

import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { suppliersKey, type Supplier } from './get-suppliers';

export function getSupplier(id: string): Promise<{ supplier: Supplier }> {
  return apiClient.get(paths.api.supplier(id));
}

export const supplierQueryOptions = (id: string) => queryOptions({ queryKey: [...suppliersKey, 'one', id] as const, queryFn: () => getSupplier(id) });

export function useSupplier(id: string | undefined) {
  return useQuery({ ...supplierQueryOptions(id ?? ''), enabled: Boolean(id) });
}

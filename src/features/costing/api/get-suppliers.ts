import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { Supplier } from './types';

export function getSuppliers(): Promise<{ suppliers: Supplier[] }> {
  return apiClient.get(paths.api.suppliers());
}

/** The suppliers a pack can name (the purchase-order pages own their editing). */
export const suppliersQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'suppliers'] as const, queryFn: getSuppliers });

export function useSuppliers() {
  return useQuery(suppliersQueryOptions());
}

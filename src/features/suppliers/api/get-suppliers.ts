import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

export type PaymentTerms = 'card' | 'account';

/** A supplier with its ordering terms, as GET /api/suppliers lists it. */
export interface Supplier {
  id: string;
  name: string;
  contactName: string | null;
  orderEmail: string | null;
  phone: string | null;
  accountNumber: string | null;
  notes: string | null;
  paymentTerms: PaymentTerms;
  minimumOrder: string;
  /** ISO weekdays, 1 = Monday … 7 = Sunday. */
  deliveryDays: number[];
  orderCutoff: string;
  leadDays: number;
  deliveryCharge: string;
}

export function getSuppliers(): Promise<{ suppliers: Supplier[] }> {
  return apiClient.get(paths.api.suppliers());
}

export const suppliersKey = ['suppliers'] as const;

export const suppliersQueryOptions = () => queryOptions({ queryKey: [...suppliersKey, 'list'] as const, queryFn: getSuppliers });

export function useSuppliers() {
  return useQuery(suppliersQueryOptions());
}

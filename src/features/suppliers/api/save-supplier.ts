import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { suppliersKey, type PaymentTerms, type Supplier } from './get-suppliers';

export interface SupplierDetailsIn {
  name: string;
  contactName: string | null;
  orderEmail: string | null;
  phone: string | null;
  accountNumber: string | null;
  notes: string | null;
}

export interface SupplierOrderingIn {
  minimumOrder: string;
  deliveryDays: number[];
  orderCutoff: string;
  leadDays: number;
  deliveryCharge: string;
  paymentTerms: PaymentTerms;
}

/**
 * The supplier's details and its ordering terms are two resources on the server (the
 * costing side owns the first, the ordering side the second): save the details, then the terms.
 */
export async function saveSupplier({ id, details, ordering }: { id?: string; details: SupplierDetailsIn; ordering: SupplierOrderingIn }): Promise<{ supplier: Supplier }> {
  const saved = id
    ? await apiClient.patch<{ supplier: Supplier }>(paths.api.supplier(id), details)
    : await apiClient.post<{ supplier: Supplier }>(paths.api.suppliers(), details);
  await apiClient.put(paths.api.supplierOrdering(saved.supplier.id), ordering);
  return apiClient.get<{ supplier: Supplier }>(paths.api.supplier(saved.supplier.id));
}

export function deleteSupplier(id: string): Promise<void> {
  return apiClient.delete(paths.api.supplier(id));
}

export function useSaveSupplier() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveSupplier,
    // A half-done save (details saved, terms refused) still changed the list.
    onSettled: () => queryClient.invalidateQueries({ queryKey: suppliersKey }),
  });
}

export function useDeleteSupplier() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSupplier,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: suppliersKey }),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { call, invalidate, useContractMutation } from '../../../lib/contract';
import { paths } from '../../../lib/paths';
import { createSupplier, deleteSupplier, getSupplier, updateSupplier, type SupplierDetailsIn } from '../../../shared/contract/suppliers';
import type { z } from 'zod';
import type { supplierOrderingSchema } from '../../../shared/ordering';

export type SupplierOrderingIn = z.input<typeof supplierOrderingSchema>;

/**
 * The supplier's details and its ordering terms are two resources on the server (the
 * supplier's own and the purchasing side's): save the details, then the terms.
 */
export async function saveSupplier({ id, details, ordering }: { id?: string; details: SupplierDetailsIn; ordering: SupplierOrderingIn }) {
  const saved = id ? await call(updateSupplier, { params: { id }, body: details }) : await call(createSupplier, { body: details });
  await apiClient.put(paths.api.supplierOrdering(saved.supplier.id), ordering);
  return call(getSupplier, { params: { id: saved.supplier.id } });
}

export function useSaveSupplier() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveSupplier,
    // A half-done save (details saved, terms refused) still changed the list.
    onSettled: () => invalidate(queryClient, '/api/suppliers'),
  });
}

export function useDeleteSupplier() {
  return useContractMutation(deleteSupplier, { invalidates: ['/api/suppliers'] });
}

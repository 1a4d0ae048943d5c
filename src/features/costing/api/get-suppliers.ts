import { useContractQuery } from '../../../lib/contract';
import { listSuppliers } from '../../../shared/contract/suppliers';

/** The suppliers a pack can name (the purchase-order pages own their editing). */
export function useSuppliers() {
  return useContractQuery(listSuppliers);
}

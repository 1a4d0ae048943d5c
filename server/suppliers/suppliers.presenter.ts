import { writeMoney } from '../../src/shared/money';
import type { Supplier } from '../../src/shared/contract/suppliers';
import type { SupplierRow } from './suppliers.repo';

/** A supplier with its ordering terms; money in the business's currency ("40.00"), delivery days as ISO weekdays (1 = Monday). */
export function presentSupplier(r: SupplierRow, currency: string): Supplier {
  return {
    id: r.id, name: r.name, contactName: r.contact_name, orderEmail: r.order_email, phone: r.phone, accountNumber: r.account_number, notes: r.notes,
    paymentTerms: r.payment_terms, minimumOrder: writeMoney(r.minimum_order, currency), deliveryDays: r.delivery_days, orderCutoff: r.order_cutoff,
    leadDays: r.lead_days, deliveryCharge: writeMoney(r.delivery_charge, currency),
  };
}

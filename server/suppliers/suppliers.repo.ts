import type { Knex } from 'knex';
import type { SupplierTerms } from '../orders/orders.repo';

// The ordering terms (minimum, delivery days, cut-off, lead time, charge, how paid) live on the
// same row; they are read here and written through PUT /api/suppliers/:id/ordering.
export const SUPPLIER_COLUMNS = [
  'id', 'name', 'contact_name', 'order_email', 'phone', 'account_number', 'notes',
  'minimum_order', 'delivery_days', 'order_cutoff', 'lead_days', 'delivery_charge', 'payment_terms',
];

/** The supplier row: its details and the ordering terms the purchase-order side reads (SupplierTerms). */
export interface SupplierRow extends SupplierTerms {
  notes: string | null;
}

/** The columns the basic supplier form writes (the ordering terms have their own route). */
export type SupplierDetails = Pick<SupplierRow, 'name' | 'contact_name' | 'order_email' | 'phone' | 'account_number' | 'notes'>;

export async function currencyOf(db: Knex, businessId: string): Promise<string> {
  return (await db('businesses').where({ id: businessId }).first('currency')).currency;
}

export async function listSuppliers(db: Knex, businessId: string): Promise<SupplierRow[]> {
  return db('suppliers').where({ business_id: businessId }).orderBy('name').select(SUPPLIER_COLUMNS);
}

export async function findSupplier(db: Knex, businessId: string, id: string): Promise<SupplierRow | undefined> {
  return db('suppliers').where({ business_id: businessId, id }).first(SUPPLIER_COLUMNS);
}

export async function insertSupplier(db: Knex, businessId: string, values: Partial<SupplierDetails>): Promise<SupplierRow> {
  const [row] = await db('suppliers').insert({ business_id: businessId, ...values }).returning(SUPPLIER_COLUMNS);
  return row;
}

export async function updateSupplier(db: Knex, businessId: string, id: string, values: Partial<SupplierDetails>): Promise<SupplierRow | undefined> {
  const [row] = await db('suppliers').where({ business_id: businessId, id }).update({ ...values, updated_at: db.fn.now() }).returning(SUPPLIER_COLUMNS);
  return row;
}

export async function deleteSupplier(db: Knex, businessId: string, id: string): Promise<number> {
  return db('suppliers').where({ business_id: businessId, id }).delete();
}

/** Does a live pack name this supplier? (An archived pack keeps its history without it.) */
export async function supplierHasPacks(db: Knex, businessId: string, id: string): Promise<boolean> {
  return Boolean(await db('packs').where({ business_id: businessId, supplier_id: id }).whereNull('archived_at').first('id'));
}

/** Has the supplier any purchase order (which names it for good)? */
export async function supplierHasOrders(db: Knex, businessId: string, id: string): Promise<boolean> {
  return Boolean(await db('purchase_orders').where({ business_id: businessId, supplier_id: id }).first('id'));
}

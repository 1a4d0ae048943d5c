import type { Knex } from 'knex';

export const SUPPLIER_COLUMNS = ['id', 'name', 'contact_name', 'order_email', 'phone', 'account_number', 'notes'];

export interface SupplierRow {
  id: string;
  name: string;
  contact_name: string | null;
  order_email: string | null;
  phone: string | null;
  account_number: string | null;
  notes: string | null;
}

export async function listSuppliers(db: Knex, businessId: string): Promise<SupplierRow[]> {
  return db('suppliers').where({ business_id: businessId }).orderBy('name').select(SUPPLIER_COLUMNS);
}

export async function findSupplier(db: Knex, businessId: string, id: string): Promise<SupplierRow | undefined> {
  return db('suppliers').where({ business_id: businessId, id }).first(SUPPLIER_COLUMNS);
}

export async function insertSupplier(db: Knex, businessId: string, values: Partial<SupplierRow>): Promise<SupplierRow> {
  const [row] = await db('suppliers').insert({ business_id: businessId, ...values }).returning(SUPPLIER_COLUMNS);
  return row;
}

export async function updateSupplier(db: Knex, businessId: string, id: string, values: Partial<SupplierRow>): Promise<SupplierRow | undefined> {
  const [row] = await db('suppliers').where({ business_id: businessId, id }).update({ ...values, updated_at: db.fn.now() }).returning(SUPPLIER_COLUMNS);
  return row;
}

export async function deleteSupplier(db: Knex, businessId: string, id: string): Promise<number> {
  return db('suppliers').where({ business_id: businessId, id }).delete();
}

export async function supplierHasPacks(db: Knex, businessId: string, id: string): Promise<boolean> {
  return Boolean(await db('packs').where({ business_id: businessId, supplier_id: id }).first('id'));
}

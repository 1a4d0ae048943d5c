import type { z } from 'zod';
import type { AppDeps } from '../platform/deps';
import { conflict, notFound } from '../platform/errors';
import { guardWrite } from '../platform/db-errors';
import type { supplierDetailsSchema, Supplier } from '../../src/shared/contract/suppliers';
import { currencyOf, deleteSupplier, findSupplier, insertSupplier, listSuppliers, supplierHasOrders, supplierHasPacks, updateSupplier, type SupplierDetails } from './suppliers.repo';
import { presentSupplier } from './suppliers.presenter';

type DetailsIn = Partial<z.output<typeof supplierDetailsSchema>>;

function columns(s: DetailsIn): Partial<SupplierDetails> {
  const out: Partial<SupplierDetails> = {};
  if (s.name !== undefined) out.name = s.name;
  if (s.contactName !== undefined) out.contact_name = s.contactName ?? null;
  if (s.orderEmail !== undefined) out.order_email = s.orderEmail ?? null;
  if (s.phone !== undefined) out.phone = s.phone ?? null;
  if (s.accountNumber !== undefined) out.account_number = s.accountNumber ?? null;
  if (s.notes !== undefined) out.notes = s.notes ?? null;
  return out;
}

export async function list({ db }: AppDeps, businessId: string): Promise<Supplier[]> {
  const [rows, currency] = await Promise.all([listSuppliers(db, businessId), currencyOf(db, businessId)]);
  return rows.map((s) => presentSupplier(s, currency));
}

export async function get({ db }: AppDeps, businessId: string, id: string): Promise<Supplier> {
  const s = await findSupplier(db, businessId, id);
  if (!s) throw notFound('That supplier');
  return presentSupplier(s, await currencyOf(db, businessId));
}

export async function create({ db }: AppDeps, businessId: string, input: DetailsIn): Promise<Supplier> {
  const s = await guardWrite('A supplier', () => insertSupplier(db, businessId, columns(input)));
  return presentSupplier(s, await currencyOf(db, businessId));
}

export async function update({ db }: AppDeps, businessId: string, id: string, input: DetailsIn): Promise<Supplier> {
  const s = await guardWrite('A supplier', () => updateSupplier(db, businessId, id, columns(input)));
  if (!s) throw notFound('That supplier');
  return presentSupplier(s, await currencyOf(db, businessId));
}

export async function remove({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  if (!(await findSupplier(db, businessId, id))) throw notFound('That supplier');
  // Packs would silently lose their supplier (ON DELETE SET NULL): ask first.
  if (await supplierHasPacks(db, businessId, id)) throw conflict('in_use', 'Packs are still bought from this supplier. Move or remove them first.');
  // Its orders keep naming it (their supplier, its terms): the supplier stays with them.
  if (await supplierHasOrders(db, businessId, id)) throw conflict('in_use', 'This supplier has purchase orders, which keep its name and terms, so it cannot be removed.');
  // Archived packs that named it keep their history without it (ON DELETE SET NULL).
  await guardWrite('That supplier', () => deleteSupplier(db, businessId, id));
}

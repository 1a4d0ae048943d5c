import type { Knex } from 'knex';

/** Plain rows of purchase orders, their lines, events and receipts (Knex queries only). */

export interface OrderRow {
  id: string;
  business_id: string;
  site_id: string;
  supplier_id: string;
  number: string;
  status: OrderStatus;
  currency: string;
  subtotal: string;
  tax: string;
  delivery_charge: string;
  total: string;
  payment_terms: 'card' | 'account';
  expected_on: string | null;
  notes: string | null;
  supplier_invoice_number: string | null;
  invoice_path: string | null;
  invoice_content_type: string | null;
  invoice_original_name: string | null;
  placed_at: Date | null;
  emailed_at: Date | null;
  emailed_to: string | null;
  email_message_id: string | null;
  paid_at: Date | null;
  payment_reference: string | null;
  received_at: Date | null;
  closed_at: Date | null;
  cancelled_at: Date | null;
  created_by: string | null;
  version: number;
  created_at: Date;
  updated_at: Date;
}

export type OrderStatus = 'draft' | 'placed' | 'paid' | 'part_received' | 'received' | 'closed' | 'cancelled';

export interface LineRow {
  id: string;
  order_id: string;
  pack_id: string;
  position: number;
  description: string;
  quantity: string;
  unit_price: string;
  tax_pct: string;
  line_total: string;
  quantity_received: string;
  note: string | null;
}

export interface EventRow {
  id: string;
  kind: string;
  message: string;
  data: unknown;
  actor_id: string | null;
  actor_name: string | null;
  at: Date;
}

export interface SupplierTerms {
  id: string;
  name: string;
  contact_name: string | null;
  order_email: string | null;
  phone: string | null;
  account_number: string | null;
  minimum_order: string;
  delivery_days: number[];
  order_cutoff: string;
  lead_days: number;
  delivery_charge: string;
  payment_terms: 'card' | 'account';
}

export interface PackForOrder {
  id: string;
  supplier_id: string | null;
  description: string;
  supplier_code: string | null;
  purchase_tax_pct: string;
  ingredient_name: string;
  price: string | null;
  archived_at: Date | null;
}

type Db = Knex | Knex.Transaction;

export async function findOrder(db: Db, businessId: string, id: string, lock = false): Promise<OrderRow | undefined> {
  const q = db('purchase_orders').where({ business_id: businessId, id }).first();
  return lock ? q.forUpdate() : q;
}

export async function listOrders(db: Db, businessId: string, filter: { siteId?: string; status?: string; supplierId?: string }) {
  const q = db('purchase_orders as o')
    .join('suppliers as s', 's.id', 'o.supplier_id')
    .join('sites as si', 'si.id', 'o.site_id')
    .where('o.business_id', businessId)
    .orderBy('o.created_at', 'desc')
    .limit(500)
    .select('o.id', 'o.number', 'o.status', 'o.site_id', 'si.name as site_name', 'o.supplier_id', 's.name as supplier_name', 'o.total', 'o.currency',
      'o.payment_terms', 'o.expected_on', 'o.created_at', 'o.placed_at');
  if (filter.siteId) q.where('o.site_id', filter.siteId);
  if (filter.status) q.where('o.status', filter.status);
  if (filter.supplierId) q.where('o.supplier_id', filter.supplierId);
  return q;
}

export async function orderLines(db: Db, orderId: string): Promise<LineRow[]> {
  return db('purchase_order_lines').where({ order_id: orderId }).orderBy('position').select('*');
}

export async function orderEvents(db: Db, orderId: string): Promise<EventRow[]> {
  return db('purchase_order_events as e')
    .leftJoin('users as u', 'u.id', 'e.actor_id')
    .where('e.order_id', orderId)
    .orderBy([{ column: 'e.at', order: 'asc' }, { column: 'e.id', order: 'asc' }])
    .select('e.id', 'e.kind', 'e.message', 'e.data', 'e.actor_id', 'u.name as actor_name', 'e.at');
}

export async function addEvent(db: Db, businessId: string, orderId: string, actorId: string | null, kind: string, message: string, data?: unknown) {
  // clock_timestamp(): several events in one transaction keep their order.
  await db('purchase_order_events').insert({
    business_id: businessId, order_id: orderId, actor_id: actorId, kind, message, data: data === undefined ? null : JSON.stringify(data), at: db.raw('clock_timestamp()'),
  });
}

export async function supplierTerms(db: Db, businessId: string, supplierId: string): Promise<SupplierTerms | undefined> {
  return db('suppliers').where({ business_id: businessId, id: supplierId })
    .first('id', 'name', 'contact_name', 'order_email', 'phone', 'account_number', 'minimum_order', 'delivery_days', 'order_cutoff', 'lead_days', 'delivery_charge', 'payment_terms');
}

/** Packs with the price in force on `asOf` (the latest price whose effective date is not after it). */
export async function packsForOrder(db: Db, businessId: string, packIds: string[], asOf: string): Promise<PackForOrder[]> {
  if (packIds.length === 0) return [];
  return db('packs as p')
    .join('ingredients as i', 'i.id', 'p.ingredient_id')
    .where('p.business_id', businessId)
    .whereIn('p.id', packIds)
    .select('p.id', 'p.supplier_id', 'p.description', 'p.supplier_code', 'p.purchase_tax_pct', 'i.name as ingredient_name', 'p.archived_at',
      db.raw(`(select pp.price from pack_prices pp where pp.pack_id = p.id and pp.effective_from <= ?
               order by pp.effective_from desc, pp.created_at desc limit 1) as price`, [asOf]));
}

export async function siteOfBusiness(db: Db, businessId: string, siteId: string) {
  return db('sites').where({ business_id: businessId, id: siteId }).first('id', 'name');
}

export async function businessOf(db: Db, businessId: string) {
  return db('businesses').where({ id: businessId }).first('id', 'name', 'currency', 'country');
}

/** The next order number for the business, e.g. PO-00042; call inside a transaction holding the business's order lock. */
export async function nextOrderNumber(trx: Knex.Transaction, businessId: string): Promise<string> {
  // Serialises numbering per business for the rest of the transaction.
  await trx.raw('select pg_advisory_xact_lock(hashtext(?))', [`purchase-order-number:${businessId}`]);
  const row = await trx('purchase_orders').where({ business_id: businessId }).count<{ n: string }[]>({ n: '*' }).first();
  return `PO-${String(Number(row?.n ?? 0) + 1).padStart(5, '0')}`;
}

export async function receiptsOf(db: Db, orderId: string) {
  return db('receipts as r').leftJoin('users as u', 'u.id', 'r.received_by').where('r.order_id', orderId).orderBy('r.created_at')
    .select('r.id', 'r.received_on', 'r.supplier_invoice_number', 'r.notes', 'u.name as received_by_name', 'r.created_at');
}

export async function receiptLinesOf(db: Db, receiptIds: string[]) {
  if (receiptIds.length === 0) return [];
  return db('receipt_lines').whereIn('receipt_id', receiptIds).select('id', 'receipt_id', 'order_line_id', 'pack_id', 'quantity', 'unit_price', 'net', 'tax', 'note');
}

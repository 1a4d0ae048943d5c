import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export type PaymentStatus = 'pending' | 'unknown' | 'requires_action' | 'succeeded' | 'failed' | 'refunded';

export interface PaymentRow {
  id: string;
  business_id: string;
  order_id: string;
  attempt: number;
  idempotency_key: string;
  intent_id: string | null;
  status: PaymentStatus;
  amount_minor: string;
  currency: string;
  payment_method_id: string | null;
  customer_id: string | null;
  failure_code: string | null;
  message: string | null;
  next_action_url: string | null;
  refund_id: string | null;
  created_at: Date;
  updated_at: Date;
}

export interface SavedCardRow {
  business_id: string;
  customer_id: string;
  payment_method_id: string | null;
  card_brand: string | null;
  card_last4: string | null;
  card_exp_month: number | null;
  card_exp_year: number | null;
}

export async function latestPayment(db: Db, orderId: string): Promise<PaymentRow | undefined> {
  return db('payments').where({ order_id: orderId }).orderBy('attempt', 'desc').first();
}

export async function findPayment(db: Db, id: string, lock = false): Promise<PaymentRow | undefined> {
  const q = db('payments').where({ id }).first();
  return lock ? q.forUpdate() : q;
}

export async function paymentByIntent(db: Db, intentId: string): Promise<PaymentRow | undefined> {
  return db('payments').where({ intent_id: intentId }).first();
}

export async function paymentByKey(db: Db, key: string): Promise<PaymentRow | undefined> {
  return db('payments').where({ idempotency_key: key }).first();
}

export async function insertPayment(db: Db, row: Omit<PaymentRow, 'id' | 'created_at' | 'updated_at' | 'intent_id' | 'failure_code' | 'message' | 'next_action_url' | 'refund_id'>): Promise<PaymentRow> {
  const [p] = await db('payments').insert(row).returning('*');
  return p;
}

export async function updatePayment(db: Db, id: string, values: Partial<PaymentRow>): Promise<void> {
  await db('payments').where({ id }).update({ ...values, updated_at: db.fn.now() });
}

export async function savedCard(db: Db, businessId: string): Promise<SavedCardRow | undefined> {
  return db('payment_customers').where({ business_id: businessId }).first();
}

export async function upsertSavedCard(db: Db, row: SavedCardRow): Promise<void> {
  await db('payment_customers').insert(row).onConflict('business_id').merge({ ...row, updated_at: db.fn.now() });
}

export async function forgetCard(db: Db, businessId: string): Promise<void> {
  await db('payment_customers').where({ business_id: businessId })
    .update({ payment_method_id: null, card_brand: null, card_last4: null, card_exp_month: null, card_exp_year: null, updated_at: db.fn.now() });
}

/** Records a webhook event id; false when it was already recorded (a replay). */
export async function recordWebhookEvent(db: Db, id: string, type: string): Promise<boolean> {
  const rows = await db('webhook_events').insert({ id, type }).onConflict('id').ignore().returning('id');
  return rows.length === 1;
}

import type { Knex } from 'knex';

// Stock, purchase orders and payments, and the books: counts, waste, till
// sales, month-end periods. Every table carries business_id; money and
// quantities are numeric.
export async function up(knex: Knex) {
  const id = (t: Knex.CreateTableBuilder) => t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
  const biz = (t: Knex.CreateTableBuilder) => t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE').index();
  const site = (t: Knex.CreateTableBuilder) => t.uuid('site_id').notNullable().references('sites.id').onDelete('CASCADE').index();
  const who = (t: Knex.CreateTableBuilder, name: string) => t.uuid(name).references('users.id').onDelete('SET NULL');

  // Where things are kept at a site (fridge, bar, dry store): the business names its own.
  await knex.schema.createTable('storage_areas', (t) => {
    id(t); biz(t); site(t);
    t.text('name').notNullable();
    t.integer('position').notNullable().defaultTo(0);
    t.unique(['site_id', 'name']);
  });

  // A pack stocked at a site, with its par level and reorder point in packs.
  await knex.schema.createTable('stock_items', (t) => {
    id(t); biz(t); site(t);
    t.uuid('pack_id').notNullable().references('packs.id').onDelete('CASCADE');
    t.uuid('storage_area_id').references('storage_areas.id').onDelete('SET NULL');
    t.decimal('par_level', 14, 4).notNullable().defaultTo(0);
    t.decimal('reorder_point', 14, 4).notNullable().defaultTo(0);
    t.timestamps(true, true);
    t.unique(['site_id', 'pack_id']);
  });

  await knex.schema.createTable('purchase_orders', (t) => {
    id(t); biz(t); site(t);
    t.uuid('supplier_id').notNullable().references('suppliers.id').onDelete('RESTRICT');
    t.text('number').notNullable();
    t.string('status', 16).notNullable().defaultTo('draft')
      .checkIn(['draft', 'placed', 'paid', 'part_received', 'received', 'closed', 'cancelled']);
    t.string('currency', 3).notNullable();
    t.decimal('subtotal', 14, 4).notNullable().defaultTo(0);
    t.decimal('tax', 14, 4).notNullable().defaultTo(0);
    t.decimal('delivery_charge', 14, 4).notNullable().defaultTo(0);
    t.decimal('total', 14, 4).notNullable().defaultTo(0);
    t.string('payment_terms', 10).notNullable().checkIn(['card', 'account']);
    t.date('expected_on');
    t.text('notes');
    t.text('supplier_invoice_number');
    t.text('invoice_path');
    t.text('invoice_content_type');
    t.text('invoice_original_name');
    t.timestamp('placed_at', { useTz: true });
    t.timestamp('emailed_at', { useTz: true });
    t.text('email_message_id');
    t.timestamp('paid_at', { useTz: true });
    t.text('payment_reference');
    t.timestamp('received_at', { useTz: true });
    t.timestamp('closed_at', { useTz: true });
    t.timestamp('cancelled_at', { useTz: true });
    who(t, 'created_by');
    // Bumped on every change: optimistic concurrency for edits.
    t.integer('version').notNullable().defaultTo(0);
    t.timestamps(true, true);
    t.unique(['business_id', 'number']);
  });

  await knex.schema.createTable('purchase_order_lines', (t) => {
    id(t); biz(t);
    t.uuid('order_id').notNullable().references('purchase_orders.id').onDelete('CASCADE').index();
    t.uuid('pack_id').notNullable().references('packs.id').onDelete('RESTRICT');
    t.integer('position').notNullable().defaultTo(0);
    t.text('description').notNullable();
    t.decimal('quantity', 14, 4).notNullable();
    t.decimal('unit_price', 14, 4).notNullable();
    t.decimal('tax_pct', 7, 4).notNullable().defaultTo(0);
    t.decimal('line_total', 14, 4).notNullable();
    t.decimal('quantity_received', 14, 4).notNullable().defaultTo(0);
    t.text('note');
  });

  // The order's timeline: every change with who and when.
  await knex.schema.createTable('purchase_order_events', (t) => {
    id(t); biz(t);
    t.uuid('order_id').notNullable().references('purchase_orders.id').onDelete('CASCADE').index();
    t.text('kind').notNullable();
    t.text('message').notNullable();
    t.jsonb('data');
    who(t, 'actor_id');
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  // A delivery against an order (an order may arrive in several).
  await knex.schema.createTable('receipts', (t) => {
    id(t); biz(t); site(t);
    t.uuid('order_id').notNullable().references('purchase_orders.id').onDelete('CASCADE').index();
    t.date('received_on').notNullable();
    t.text('supplier_invoice_number');
    t.text('notes');
    who(t, 'received_by');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['business_id', 'received_on']);
  });
  await knex.schema.createTable('receipt_lines', (t) => {
    id(t); biz(t);
    t.uuid('receipt_id').notNullable().references('receipts.id').onDelete('CASCADE').index();
    t.uuid('order_line_id').references('purchase_order_lines.id').onDelete('SET NULL');
    t.uuid('pack_id').notNullable().references('packs.id').onDelete('RESTRICT');
    t.decimal('quantity', 14, 4).notNullable();
    t.decimal('unit_price', 14, 4).notNullable();
    t.decimal('net', 14, 4).notNullable();
    t.decimal('tax', 14, 4).notNullable().defaultTo(0);
    t.text('note');
  });

  // The business's saved card at the payment provider (never the card number).
  await knex.schema.createTable('payment_customers', (t) => {
    t.uuid('business_id').primary().references('businesses.id').onDelete('CASCADE');
    t.text('customer_id').notNullable();
    t.text('payment_method_id');
    t.text('card_brand');
    t.string('card_last4', 4);
    t.integer('card_exp_month');
    t.integer('card_exp_year');
    t.timestamps(true, true);
  });

  // One row per attempt to pay an order; the idempotency key makes a retry of
  // the same attempt find the same payment intent instead of charging again.
  await knex.schema.createTable('payments', (t) => {
    id(t); biz(t);
    t.uuid('order_id').notNullable().references('purchase_orders.id').onDelete('CASCADE').index();
    t.integer('attempt').notNullable();
    t.text('idempotency_key').notNullable().unique();
    t.text('intent_id').unique();
    t.string('status', 20).notNullable()
      .checkIn(['pending', 'unknown', 'requires_action', 'succeeded', 'failed', 'refunded']);
    t.bigInteger('amount_minor').notNullable();
    t.string('currency', 3).notNullable();
    t.text('payment_method_id');
    t.text('failure_code');
    t.text('message');
    t.text('refund_id');
    t.timestamps(true, true);
    t.unique(['order_id', 'attempt']);
  });

  // Webhook events already handled: a replay changes nothing.
  await knex.schema.createTable('webhook_events', (t) => {
    t.text('id').primary();
    t.text('type').notNullable();
    t.timestamp('received_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('stock_counts', (t) => {
    id(t); biz(t); site(t);
    t.date('count_date').notNullable();
    t.string('status', 10).notNullable().defaultTo('open').checkIn(['open', 'finished']);
    who(t, 'started_by');
    t.timestamp('finished_at', { useTz: true });
    who(t, 'finished_by');
    t.timestamps(true, true);
    t.index(['site_id', 'count_date']);
  });
  await knex.schema.createTable('stock_count_lines', (t) => {
    id(t); biz(t);
    t.uuid('count_id').notNullable().references('stock_counts.id').onDelete('CASCADE').index();
    t.uuid('pack_id').notNullable().references('packs.id').onDelete('RESTRICT');
    t.uuid('storage_area_id').references('storage_areas.id').onDelete('SET NULL');
    // Whole packs plus the open pack's fraction (e.g. 3.4 packs).
    t.decimal('packs', 14, 6).notNullable();
    who(t, 'counted_by');
    t.timestamp('counted_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['count_id', 'pack_id']);
  });

  // Milk poured away, a remade drink, out-of-date stock.
  await knex.schema.createTable('waste_entries', (t) => {
    id(t); biz(t); site(t);
    t.date('occurred_on').notNullable();
    t.uuid('ingredient_id').references('ingredients.id').onDelete('RESTRICT');
    t.uuid('preparation_id').references('preparations.id').onDelete('RESTRICT');
    t.uuid('drink_size_id').references('drink_sizes.id').onDelete('RESTRICT');
    t.decimal('quantity', 14, 4).notNullable();
    t.string('unit', 12);
    t.text('reason').notNullable();
    who(t, 'recorded_by');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['site_id', 'occurred_on']);
  });
  await knex.raw(`alter table waste_entries add constraint waste_one_item check (
    (ingredient_id is not null)::int + (preparation_id is not null)::int + (drink_size_id is not null)::int = 1)`);

  await knex.schema.createTable('sales_imports', (t) => {
    id(t); biz(t); site(t);
    t.string('file_sha256', 64).notNullable();
    t.text('filename').notNullable();
    t.integer('row_count').notNullable().defaultTo(0);
    t.string('status', 10).notNullable().defaultTo('pending').checkIn(['pending', 'accepted', 'discarded']);
    t.jsonb('mapping');
    t.date('first_day');
    t.date('last_day');
    who(t, 'created_by');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('accepted_at', { useTz: true });
  });
  // The same file is counted once per site.
  await knex.raw(`create unique index sales_imports_once on sales_imports (business_id, site_id, file_sha256) where status = 'accepted'`);

  await knex.schema.createTable('sales_lines', (t) => {
    t.bigIncrements('id');
    biz(t); site(t);
    t.uuid('import_id').references('sales_imports.id').onDelete('CASCADE');
    t.date('sold_on').notNullable();
    t.uuid('drink_size_id').notNullable().references('drink_sizes.id').onDelete('RESTRICT');
    t.decimal('quantity', 14, 4).notNullable();
    t.decimal('net_sales', 14, 4).notNullable();
    t.decimal('tax', 14, 4);
    t.index(['business_id', 'site_id', 'sold_on']);
  });

  // What the till calls our drinks, remembered per business.
  await knex.schema.createTable('till_item_mappings', (t) => {
    id(t); biz(t);
    t.text('till_item').notNullable();
    t.text('till_size').notNullable().defaultTo('');
    t.uuid('drink_size_id').notNullable().references('drink_sizes.id').onDelete('CASCADE');
  });
  await knex.raw('create unique index till_item_mappings_once on till_item_mappings (business_id, lower(till_item), lower(till_size))');
  await knex.schema.createTable('till_column_mappings', (t) => {
    t.uuid('business_id').primary().references('businesses.id').onDelete('CASCADE');
    t.jsonb('mapping').notNullable();
    t.timestamps(true, true);
  });

  // Month-end: a closed month's counts, receipts and sales are read-only.
  await knex.schema.createTable('periods', (t) => {
    id(t); biz(t);
    t.date('month').notNullable(); // the first day of the month
    t.string('status', 8).notNullable().defaultTo('open').checkIn(['open', 'closed']);
    t.timestamp('closed_at', { useTz: true });
    who(t, 'closed_by');
    t.timestamps(true, true);
    t.unique(['business_id', 'month']);
  });
  await knex.schema.createTable('period_events', (t) => {
    id(t); biz(t);
    t.uuid('period_id').notNullable().references('periods.id').onDelete('CASCADE');
    t.string('action', 8).notNullable().checkIn(['close', 'reopen']);
    t.text('reason');
    who(t, 'actor_id');
    t.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex) {
  for (const t of ['period_events', 'periods', 'till_column_mappings', 'till_item_mappings', 'sales_lines', 'sales_imports', 'waste_entries',
    'stock_count_lines', 'stock_counts', 'webhook_events', 'payments', 'payment_customers', 'receipt_lines', 'receipts',
    'purchase_order_events', 'purchase_order_lines', 'purchase_orders', 'stock_items', 'storage_areas']) {
    await knex.schema.dropTable(t);
  }
}

import type { Knex } from 'knex';

// What paying and e-mailing an order needs beyond the stock/orders schema:
// the customer an attempt was made for (a settlement re-sends the very same
// parameters with the attempt's idempotency key), and where the order went.
export async function up(knex: Knex) {
  await knex.schema.alterTable('payments', (t) => {
    t.text('customer_id');
    t.text('next_action_url');
  });
  await knex.schema.alterTable('purchase_orders', (t) => {
    t.text('emailed_to');
  });
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('purchase_orders', (t) => t.dropColumn('emailed_to'));
  await knex.schema.alterTable('payments', (t) => {
    t.dropColumn('customer_id');
    t.dropColumn('next_action_url');
  });
}

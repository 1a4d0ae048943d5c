import type { Knex } from 'knex';

// Menu prices with an effective date. A price change dated after the day it is applied is
// written to menu_price_history as 'planned': drink_sizes.price keeps the price in force now,
// and every read resolves the price in force on a date as the latest planned entry dated on or
// before it, else drink_sizes.price (no background job). The next write to those drink sizes
// (a repricing apply, the drink editor) first folds the planned entries that have come due into
// drink_sizes.price and marks them 'applied'. A planned entry may be cancelled before its date.
export async function up(knex: Knex) {
  await knex.schema.alterTable('menu_price_history', (t) => {
    t.string('status', 9).notNullable().defaultTo('applied').checkIn(['applied', 'planned', 'cancelled']);
    // When a planned entry's price went into drink_sizes.price (null for entries applied at once).
    t.timestamp('applied_at', { useTz: true });
    t.timestamp('cancelled_at', { useTz: true });
    t.uuid('cancelled_by').references('users.id').onDelete('SET NULL');
  });
  await knex.raw(
    "create index menu_price_history_planned on menu_price_history (drink_size_id, effective_from) where status = 'planned'",
  );
}

export async function down(knex: Knex) {
  await knex.raw('drop index if exists menu_price_history_planned');
  await knex.schema.alterTable('menu_price_history', (t) => {
    t.dropColumn('cancelled_by');
    t.dropColumn('cancelled_at');
    t.dropColumn('applied_at');
    t.dropColumn('status');
  });
}

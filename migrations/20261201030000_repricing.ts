import type { Knex } from 'knex';

// Repricing scenarios: a named set of proposed pack price changes and, per drink
// size, what to do about the menu price (keep it, take the suggested one, or a
// typed price). Drafts change nothing live; applying one writes menu prices and
// their history in one transaction.
export async function up(knex: Knex) {
  await knex.schema.createTable('reprice_scenarios', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE').index();
    t.text('name').notNullable();
    t.text('notes');
    // [{ingredientId, newPrice}]: the new price of each ingredient's costing pack.
    t.jsonb('changes').notNullable().defaultTo('[]');
    // Costs are worked out with the pack prices in force on this date (planned ones included); null = today.
    t.date('prices_as_of');
    // [{drinkSizeId, choice: 'keep'|'suggested'|'price', price?}]; a size not listed keeps its price.
    t.jsonb('decisions').notNullable().defaultTo('[]');
    t.boolean('keep_ladder').notNullable().defaultTo(false);
    // {drinkSizeId: priceVersion} when the draft was last saved: the apply's version check.
    t.jsonb('snapshot').notNullable().defaultTo('{}');
    t.string('status', 8).notNullable().defaultTo('draft').checkIn(['draft', 'applied']);
    t.date('effective_from');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.uuid('applied_by').references('users.id').onDelete('SET NULL');
    t.timestamp('applied_at', { useTz: true });
    t.timestamps(true, true);
    t.unique(['business_id', 'name']);
  });
  await knex.schema.alterTable('menu_price_history', (t) => {
    t.foreign('scenario_id').references('reprice_scenarios.id').onDelete('SET NULL');
  });
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('menu_price_history', (t) => t.dropForeign(['scenario_id']));
  await knex.schema.dropTable('reprice_scenarios');
}

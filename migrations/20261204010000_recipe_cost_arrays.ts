import type { Knex } from 'knex';

// Recipe costs as one row per drink size and price range of a month, holding the cost of a cup
// per ingredient category as an array in the order of src/shared/categories.ts (null where the
// build uses nothing of a category). The month's theoretical cost then joins one row per size
// and range instead of one per category, and sums each element. Every month is rebuilt on its
// next report (the rows are a cache of the costing engine's figures).
export async function up(knex: Knex) {
  await knex.schema.dropTable('recipe_costs');
  await knex.schema.createTable('recipe_costs', (t) => {
    t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE');
    t.date('month').notNullable();
    t.uuid('drink_size_id').notNullable().references('drink_sizes.id').onDelete('CASCADE');
    t.date('valid_from').notNullable();
    t.date('valid_to').notNullable();
    t.specificType('costs', 'numeric(24, 12)[]').notNullable();
    t.primary(['business_id', 'month', 'drink_size_id', 'valid_from']);
  });
  await knex('recipe_cost_months').delete();
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('recipe_costs');
  await knex.schema.createTable('recipe_costs', (t) => {
    t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE');
    t.date('month').notNullable();
    t.uuid('drink_size_id').notNullable().references('drink_sizes.id').onDelete('CASCADE');
    t.string('category', 20).notNullable();
    t.date('valid_from').notNullable();
    t.date('valid_to').notNullable();
    t.decimal('cost', 24, 12).notNullable();
    t.index(['business_id', 'month', 'drink_size_id']);
  });
  await knex('recipe_cost_months').delete();
}

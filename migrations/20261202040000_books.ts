import type { Knex } from 'knex';

// What the books need beyond the stock/orders schema: recipe cost per drink size and
// ingredient category over the price ranges of a month (theoretical cost in one SQL
// statement), the report frozen when a month closes, count prices frozen at close, and a
// pending till file kept until the owner accepts or discards it.
export async function up(knex: Knex) {
  const biz = (t: Knex.CreateTableBuilder) => t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE');

  // Cost of one cup of a drink size, per ingredient category, for the days valid_from..valid_to
  // of a month (prices in force change on a few dates a month). Rebuilt for an open month when
  // the inputs' fingerprint changes; left alone once the month is closed.
  await knex.schema.createTable('recipe_costs', (t) => {
    biz(t);
    t.date('month').notNullable();
    t.uuid('drink_size_id').notNullable().references('drink_sizes.id').onDelete('CASCADE');
    t.string('category', 20).notNullable();
    t.date('valid_from').notNullable();
    t.date('valid_to').notNullable();
    t.decimal('cost', 24, 12).notNullable();
    t.index(['business_id', 'month', 'drink_size_id']);
  });
  await knex.schema.createTable('recipe_cost_months', (t) => {
    biz(t);
    t.date('month').notNullable();
    t.text('fingerprint').notNullable();
    t.timestamp('computed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['business_id', 'month']);
  });

  // The cost-of-goods report as it stood when the month was closed (site_id null = all sites).
  await knex.schema.createTable('period_reports', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    biz(t);
    t.uuid('period_id').notNullable().references('periods.id').onDelete('CASCADE');
    t.uuid('site_id').references('sites.id').onDelete('CASCADE');
    t.jsonb('report').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`create unique index period_reports_once on period_reports (period_id, coalesce(site_id, '00000000-0000-0000-0000-000000000000'::uuid))`);

  // The pack price a count line was valued at, written when its month closes.
  await knex.schema.alterTable('stock_count_lines', (t) => {
    t.decimal('frozen_price', 14, 4);
  });

  await knex.schema.createTable('sales_import_files', (t) => {
    t.uuid('import_id').primary().references('sales_imports.id').onDelete('CASCADE');
    t.text('content').notNullable();
  });

  // A month of one business's sales over all its sites, read without touching the table.
  await knex.raw('create index sales_lines_business_day on sales_lines (business_id, sold_on) include (site_id, drink_size_id, quantity, net_sales)');
  await knex.raw('create index sales_lines_import on sales_lines (import_id)');
}

export async function down(knex: Knex) {
  await knex.raw('drop index sales_lines_import');
  await knex.raw('drop index sales_lines_business_day');
  await knex.schema.dropTable('sales_import_files');
  await knex.schema.alterTable('stock_count_lines', (t) => t.dropColumn('frozen_price'));
  await knex.schema.dropTable('period_reports');
  await knex.schema.dropTable('recipe_cost_months');
  await knex.schema.dropTable('recipe_costs');
}

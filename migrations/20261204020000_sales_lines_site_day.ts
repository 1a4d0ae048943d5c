import type { Knex } from 'knex';

// A site's month of till lines read from the index alone, as the business's already is
// (sales_lines_business_day): the month's report for one site, the stock list's usage since a
// count and a day's lines then never visit the table, and the planner has no reason to pick an
// index that does. Replaces the plain (business_id, site_id, sold_on) index.
export async function up(knex: Knex) {
  await knex.raw('create index sales_lines_site_day on sales_lines (business_id, site_id, sold_on) include (drink_size_id, quantity, net_sales, import_id)');
  await knex.raw('drop index if exists sales_lines_business_id_site_id_sold_on_index');
}

export async function down(knex: Knex) {
  await knex.raw('create index if not exists sales_lines_business_id_site_id_sold_on_index on sales_lines (business_id, site_id, sold_on)');
  await knex.raw('drop index sales_lines_site_day');
}

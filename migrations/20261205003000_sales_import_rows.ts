import type { Knex } from 'knex';

// A till file is known by its rows, not only its bytes: the SHA-256 of its parsed rows (day,
// item, size, quantity, net sales; sorted and written canonically) is kept on an accepted
// import, and a site holds the same rows once, so the same sales exported again with other line
// endings or in another order are refused. Imports accepted before this have none (their files
// are gone); their byte hash still catches the very same file.
export async function up(knex: Knex) {
  await knex.schema.alterTable('sales_imports', (t) => {
    t.string('rows_sha256', 64);
  });
  await knex.raw(`create unique index sales_imports_rows_once on sales_imports (business_id, site_id, rows_sha256) where status = 'accepted' and rows_sha256 is not null`);
}

export async function down(knex: Knex) {
  await knex.raw('drop index sales_imports_rows_once');
  await knex.schema.alterTable('sales_imports', (t) => {
    t.dropColumn('rows_sha256');
  });
}

import type { Knex } from 'knex';

// Throttling counters live in PostgreSQL, not in process memory, so several
// server processes behind a load balancer share them.
export async function up(knex: Knex) {
  await knex.schema.createTable('rate_limits', (t) => {
    t.text('key').primary();
    t.integer('hits').notNullable();
    t.timestamp('reset_at', { useTz: true }).notNullable();
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('rate_limits');
}

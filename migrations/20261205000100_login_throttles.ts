import type { Knex } from 'knex';

/**
 * Sign-in throttling per account *and* address (so nobody can lock a user out from elsewhere),
 * with a lock that doubles each time it is earned again, and per address alone (password
 * spraying). Kept in PostgreSQL so that every server process shares it.
 */
export async function up(knex: Knex) {
  await knex.schema.createTable('login_throttles', (t) => {
    t.text('key').primary();
    t.integer('failures').notNullable().defaultTo(0);
    t.timestamp('window_ends', { useTz: true }).notNullable();
    t.timestamp('locked_until', { useTz: true });
    t.integer('lockouts').notNullable().defaultTo(0);
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('login_throttles');
}

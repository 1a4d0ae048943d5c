import type { Knex } from 'knex';

export async function up(knex: Knex) {
  await knex.raw('create extension if not exists pgcrypto');
  await knex.schema.createTable('businesses', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.text('name').notNullable();
    t.string('country', 2).notNullable();
    t.string('currency', 3).notNullable();
    t.string('tax_mode', 10).notNullable().checkIn(['inclusive', 'exclusive']);
    t.timestamps(true, true);
  });
  await knex.schema.createTable('sites', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.timestamps(true, true);
    t.index(['business_id']);
  });
  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE');
    t.text('email').notNullable();
    t.text('name').notNullable();
    t.text('password_hash');
    t.string('role', 12).notNullable().checkIn(['owner', 'manager', 'barista', 'bookkeeper']);
    t.timestamps(true, true);
    t.index(['business_id']);
  });
  await knex.raw('create unique index users_email_lower on users (lower(email))');
  await knex.schema.createTable('invitations', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE');
    t.text('email').notNullable();
    t.string('role', 12).notNullable().checkIn(['owner', 'manager', 'barista', 'bookkeeper']);
    t.text('token_hash').notNullable().unique();
    t.uuid('invited_by').references('users.id').onDelete('SET NULL');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('accepted_at', { useTz: true });
    t.timestamps(true, true);
  });
  await knex.schema.createTable('password_resets', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('token_hash').notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.timestamps(true, true);
  });
  // Sessions live in PostgreSQL so several server processes can share one database.
  await knex.raw(`
    create table "session" (
      "sid" varchar not null collate "default" primary key,
      "sess" json not null,
      "expire" timestamp(6) not null
    );
    create index "IDX_session_expire" on "session" ("expire");
  `);
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('session');
  await knex.schema.dropTable('password_resets');
  await knex.schema.dropTable('invitations');
  await knex.schema.dropTable('users');
  await knex.schema.dropTable('sites');
  await knex.schema.dropTable('businesses');
}

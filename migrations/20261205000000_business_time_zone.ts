import type { Knex } from 'knex';

/**
 * A business keeps its own time zone: its "today", a sale's day, a count's date and a month's
 * bounds are its own, not the server's. Existing businesses get the zone of their country's
 * capital (the demo's US business is on the east coast); sign-up sets it from the browser.
 */
export async function up(knex: Knex) {
  await knex.schema.alterTable('businesses', (t) => {
    t.text('time_zone').notNullable().defaultTo('Europe/London');
  });
  await knex.raw(`update businesses set time_zone = case country
      when 'US' then 'America/New_York' when 'CA' then 'America/Toronto' when 'IE' then 'Europe/Dublin'
      when 'DE' then 'Europe/Berlin' when 'FR' then 'Europe/Paris' when 'NL' then 'Europe/Amsterdam'
      when 'ES' then 'Europe/Madrid' when 'IT' then 'Europe/Rome' when 'AU' then 'Australia/Sydney'
      when 'NZ' then 'Pacific/Auckland' else 'Europe/London' end`);
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('businesses', (t) => {
    t.dropColumn('time_zone');
  });
}

import type { Knex } from 'knex';

/** The tax's own name where the business trades (VAT, GST, sales tax), shown beside its rate. */
export async function up(knex: Knex) {
  await knex.schema.alterTable('businesses', (t) => {
    t.text('tax_name').notNullable().defaultTo('VAT');
  });
  await knex.raw(`update businesses set tax_name = case country
      when 'US' then 'Sales tax' when 'CA' then 'Sales tax (GST/HST/PST)' when 'AU' then 'GST' when 'NZ' then 'GST'
      when 'DE' then 'VAT (USt)' when 'FR' then 'VAT (TVA)' when 'NL' then 'VAT (btw)' when 'ES' then 'VAT (IVA)' when 'IT' then 'VAT (IVA)'
      else 'VAT' end`);
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('businesses', (t) => {
    t.dropColumn('tax_name');
  });
}

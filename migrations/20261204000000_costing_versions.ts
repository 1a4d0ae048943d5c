import type { Knex } from 'knex';

// Version numbers per business and kind of data that go up with every committed change:
// - 'costing': anything a cost or a menu price is worked out from;
// - 'books': the counts, deliveries, waste and sites a month's cost of goods reads besides its
//   sales and costs.
// Readers compare them with the versions a cached result was computed at
// (server/costing/versions.ts), so unchanged figures are not worked out again.
//
// - Kept by triggers, so every write path (routes, seeds, imports, raw SQL) counts.
// - Deferred constraint triggers: the version row is locked only while the writing transaction
//   commits, never in the middle of it, so two writers cannot deadlock over it. The first row
//   of a business and kind in a transaction bumps it; the rest are skipped through a
//   transaction-local setting (one UPDATE per transaction, business and kind).
// - No foreign key: the row outlives a reset of the demo data, so a running server never sees
//   a version number it has already used for other data.
export const COSTING_TABLES = [
  'cup_sizes', 'suppliers', 'ingredients', 'packs', 'pack_prices', 'measures', 'preparations', 'preparation_lines',
  'drinks', 'drink_sizes', 'build_lines', 'menu_price_history', 'modifiers', 'modifier_lines', 'pricing_policies',
] as const;

export const BOOKS_TABLES = ['sites', 'stock_counts', 'stock_count_lines', 'receipts', 'receipt_lines', 'waste_entries'] as const;

export async function up(knex: Knex) {
  await knex.schema.createTable('data_versions', (t) => {
    t.uuid('business_id').notNullable();
    t.string('kind', 16).notNullable().checkIn(['costing', 'books']);
    t.bigInteger('version').notNullable().defaultTo(0);
    t.timestamp('changed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['business_id', 'kind']);
  });
  await knex.raw(`
    create function bump_data_version(of_kind text, biz uuid) returns void language plpgsql as $$
    declare
      seen text := coalesce(current_setting('tamp.versions_bumped', true), '');
      mark text := of_kind || ':' || biz::text || ',';
    begin
      if biz is null or position(mark in seen) > 0 then
        return;
      end if;
      perform set_config('tamp.versions_bumped', seen || mark, true);
      insert into data_versions as v (business_id, kind, version, changed_at) values (biz, of_kind, 1, now())
        on conflict (business_id, kind) do update set version = v.version + 1, changed_at = now();
    end $$;

    -- tg_argv[0]: the kind of data the table belongs to.
    create function data_row_changed() returns trigger language plpgsql as $$
    begin
      if tg_op = 'DELETE' then
        perform bump_data_version(tg_argv[0], old.business_id);
      else
        perform bump_data_version(tg_argv[0], new.business_id);
        if tg_op = 'UPDATE' and old.business_id is distinct from new.business_id then
          perform bump_data_version(tg_argv[0], old.business_id);
        end if;
      end if;
      return null;
    end $$;

    create function costing_business_changed() returns trigger language plpgsql as $$
    begin
      perform bump_data_version('costing', new.id);
      return null;
    end $$;
  `);
  const kinds: [string, readonly string[]][] = [['costing', COSTING_TABLES], ['books', BOOKS_TABLES]];
  for (const [kind, tables] of kinds) {
    for (const table of tables) {
      await knex.raw(
        `create constraint trigger ${table}_${kind}_version after insert or update or delete on ${table}
           deferrable initially deferred for each row execute function data_row_changed('${kind}')`,
      );
    }
  }
  // The business's currency and tax mode change how prices are written and worked out.
  await knex.raw(
    `create constraint trigger businesses_costing_version after update of currency, tax_mode, country on businesses
       deferrable initially deferred for each row execute function costing_business_changed()`,
  );
}

export async function down(knex: Knex) {
  await knex.raw('drop trigger if exists businesses_costing_version on businesses');
  for (const table of COSTING_TABLES) await knex.raw(`drop trigger if exists ${table}_costing_version on ${table}`);
  for (const table of BOOKS_TABLES) await knex.raw(`drop trigger if exists ${table}_books_version on ${table}`);
  await knex.raw('drop function if exists costing_business_changed(); drop function if exists data_row_changed(); drop function if exists bump_data_version(text, uuid)');
  await knex.schema.dropTable('data_versions');
}

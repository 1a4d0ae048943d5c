import type { Knex } from 'knex';

// A version number per business that goes up with every committed change to anything a cost
// or a menu price is worked out from. Readers compare it with the version a cached result was
// computed at (server/costing/versions.ts), so an unchanged menu is not costed again.
//
// - Kept by triggers, so every write path (routes, seeds, imports, raw SQL) counts.
// - Deferred constraint triggers: the version row is locked only while the writing transaction
//   commits, never in the middle of it, so two writers cannot deadlock over it. The first row
//   of a business in a transaction bumps it; the rest are skipped through a transaction-local
//   setting (one UPDATE per transaction and business, however many rows it wrote).
// - No foreign key: the row outlives a reset of the demo data, so a running server never sees
//   a version number it has already used for other data.
export const COSTING_TABLES = [
  'cup_sizes', 'suppliers', 'ingredients', 'packs', 'pack_prices', 'measures', 'preparations', 'preparation_lines',
  'drinks', 'drink_sizes', 'build_lines', 'menu_price_history', 'modifiers', 'modifier_lines', 'pricing_policies',
] as const;

export async function up(knex: Knex) {
  await knex.schema.createTable('costing_versions', (t) => {
    t.uuid('business_id').primary();
    t.bigInteger('version').notNullable().defaultTo(0);
    t.timestamp('changed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw(`
    create function bump_costing_version(biz uuid) returns void language plpgsql as $$
    declare
      seen text := coalesce(current_setting('tamp.costing_bumped', true), '');
    begin
      if biz is null or position(biz::text in seen) > 0 then
        return;
      end if;
      perform set_config('tamp.costing_bumped', seen || biz::text || ',', true);
      insert into costing_versions (business_id, version, changed_at) values (biz, 1, now())
        on conflict (business_id) do update set version = costing_versions.version + 1, changed_at = now();
    end $$;

    create function costing_row_changed() returns trigger language plpgsql as $$
    begin
      if tg_op = 'DELETE' then
        perform bump_costing_version(old.business_id);
      else
        perform bump_costing_version(new.business_id);
        if tg_op = 'UPDATE' and old.business_id is distinct from new.business_id then
          perform bump_costing_version(old.business_id);
        end if;
      end if;
      return null;
    end $$;

    create function costing_business_changed() returns trigger language plpgsql as $$
    begin
      perform bump_costing_version(new.id);
      return null;
    end $$;
  `);
  for (const table of COSTING_TABLES) {
    await knex.raw(
      `create constraint trigger ${table}_costing_version after insert or update or delete on ${table}
         deferrable initially deferred for each row execute function costing_row_changed()`,
    );
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
  await knex.raw('drop function if exists costing_business_changed(); drop function if exists costing_row_changed(); drop function if exists bump_costing_version(uuid)');
  await knex.schema.dropTable('costing_versions');
}

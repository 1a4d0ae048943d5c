import type { Knex } from 'knex';

// Costing: cup sizes, suppliers, ingredients and their packs and prices,
// measures, preparations, drinks with a build per size, modifiers, pricing
// policy and menu price history. Every table carries business_id; money and
// quantities are numeric.
export async function up(knex: Knex) {
  const id = (t: Knex.CreateTableBuilder) => t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
  const biz = (t: Knex.CreateTableBuilder) => t.uuid('business_id').notNullable().references('businesses.id').onDelete('CASCADE').index();

  await knex.schema.createTable('cup_sizes', (t) => {
    id(t); biz(t);
    t.text('name').notNullable();
    t.decimal('volume_ml', 14, 4).notNullable();
    t.integer('position').notNullable().defaultTo(0);
    t.timestamps(true, true);
    t.unique(['business_id', 'name']);
  });

  await knex.schema.createTable('suppliers', (t) => {
    id(t); biz(t);
    t.text('name').notNullable();
    t.text('contact_name');
    t.text('order_email');
    t.text('phone');
    t.text('account_number');
    t.decimal('minimum_order', 14, 4).notNullable().defaultTo(0);
    // ISO weekday numbers, 1 = Monday … 7 = Sunday.
    t.specificType('delivery_days', 'smallint[]').notNullable().defaultTo('{}');
    t.string('order_cutoff', 5).notNullable().defaultTo('12:00');
    t.integer('lead_days').notNullable().defaultTo(1);
    t.decimal('delivery_charge', 14, 4).notNullable().defaultTo(0);
    t.string('payment_terms', 10).notNullable().defaultTo('account').checkIn(['card', 'account']);
    t.text('notes');
    t.timestamps(true, true);
    t.unique(['business_id', 'name']);
  });

  await knex.schema.createTable('ingredients', (t) => {
    id(t); biz(t);
    t.text('name').notNullable();
    t.string('category', 20).notNullable().checkIn(['coffee', 'dairy', 'plant-milk', 'syrup-sauce', 'powder', 'tea', 'extras', 'packaging', 'other']);
    t.string('base_unit', 4).notNullable().checkIn(['g', 'ml', 'each']);
    t.decimal('density_g_per_ml', 14, 6);
    t.decimal('yield_pct', 7, 4).notNullable().defaultTo(100);
    t.specificType('allergens', 'text[]').notNullable().defaultTo('{}');
    t.text('notes');
    // The pack that sets the cost; null means the most recently priced one.
    t.uuid('costing_pack_id');
    t.timestamp('archived_at', { useTz: true });
    t.timestamps(true, true);
    t.unique(['business_id', 'name']);
  });

  await knex.schema.createTable('packs', (t) => {
    id(t); biz(t);
    t.uuid('ingredient_id').notNullable().references('ingredients.id').onDelete('CASCADE').index();
    t.uuid('supplier_id').references('suppliers.id').onDelete('SET NULL').index();
    t.text('description').notNullable();
    t.text('supplier_code');
    t.decimal('count', 14, 4).notNullable().defaultTo(1);
    t.decimal('quantity', 14, 4).notNullable();
    t.string('unit', 12).notNullable();
    t.decimal('purchase_tax_pct', 7, 4).notNullable().defaultTo(0);
    t.timestamp('archived_at', { useTz: true });
    t.timestamps(true, true);
  });
  await knex.schema.alterTable('ingredients', (t) => {
    t.foreign('costing_pack_id').references('packs.id').onDelete('SET NULL');
  });

  // Every price a pack has had or will have: the one in force on a date is the
  // latest whose effective_from is not after it.
  await knex.schema.createTable('pack_prices', (t) => {
    id(t); biz(t);
    t.uuid('pack_id').notNullable().references('packs.id').onDelete('CASCADE');
    t.decimal('price', 14, 4).notNullable();
    t.date('effective_from').notNullable();
    t.string('source', 12).notNullable().defaultTo('manual').checkIn(['manual', 'delivery', 'reprice', 'seed']);
    t.text('note');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['pack_id', 'effective_from']);
  });

  await knex.schema.createTable('preparations', (t) => {
    id(t); biz(t);
    t.text('name').notNullable();
    t.decimal('yield_quantity', 14, 4).notNullable();
    t.string('yield_unit', 12).notNullable();
    t.decimal('density_g_per_ml', 14, 6);
    t.text('method');
    t.timestamp('archived_at', { useTz: true });
    t.timestamps(true, true);
    t.unique(['business_id', 'name']);
  });

  // A named portion of an ingredient or a preparation: a pump, a shot, a scoop.
  await knex.schema.createTable('measures', (t) => {
    id(t); biz(t);
    t.uuid('ingredient_id').references('ingredients.id').onDelete('CASCADE');
    t.uuid('preparation_id').references('preparations.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.decimal('quantity', 14, 4).notNullable();
    t.string('unit', 12).notNullable();
    t.timestamps(true, true);
  });
  await knex.raw('alter table measures add constraint measures_one_owner check ((ingredient_id is null) <> (preparation_id is null))');
  await knex.raw('create unique index measures_name_per_item on measures (coalesce(ingredient_id, preparation_id), lower(name))');

  // Lines shared in shape by preparations, builds and modifiers: an item
  // (ingredient or preparation), a quantity, and a unit or a measure.
  const lineColumns = (t: Knex.CreateTableBuilder) => {
    t.integer('position').notNullable().defaultTo(0);
    t.uuid('ingredient_id').references('ingredients.id').onDelete('RESTRICT');
    t.uuid('preparation_id').references('preparations.id').onDelete('RESTRICT');
    t.decimal('quantity', 14, 4).notNullable();
    // A standard unit (g, ml, each, fl_oz_us, …) or, with measure_id, null.
    t.string('unit', 12);
    t.uuid('measure_id').references('measures.id').onDelete('RESTRICT');
  };
  const lineChecks = async (table: string, itemCol = 'preparation_id') => {
    await knex.raw(`alter table ${table} add constraint ${table}_one_item check ((ingredient_id is null) <> (${itemCol} is null))`);
    await knex.raw(`alter table ${table} add constraint ${table}_unit_or_measure check ((unit is null) <> (measure_id is null))`);
  };

  await knex.schema.createTable('preparation_lines', (t) => {
    id(t); biz(t);
    t.uuid('parent_id').notNullable().references('preparations.id').onDelete('CASCADE').index();
    lineColumns(t);
  });
  await lineChecks('preparation_lines');

  await knex.schema.createTable('drinks', (t) => {
    id(t); biz(t);
    t.text('name').notNullable();
    t.text('category').notNullable().defaultTo('Espresso');
    t.string('temperature', 5).notNullable().defaultTo('hot').checkIn(['hot', 'iced']);
    t.text('notes');
    // Cups a week the owner expects, used for the money impact until till sales exist.
    t.integer('expected_weekly_cups');
    t.timestamp('archived_at', { useTz: true });
    t.timestamps(true, true);
    t.unique(['business_id', 'name']);
  });

  await knex.schema.createTable('drink_sizes', (t) => {
    id(t); biz(t);
    t.uuid('drink_id').notNullable().references('drinks.id').onDelete('CASCADE').index();
    t.uuid('size_id').notNullable().references('cup_sizes.id').onDelete('RESTRICT');
    // The menu price in force now (gross when the business prices tax-inclusive).
    t.decimal('price', 14, 4);
    // Bumped on every price change: the version check for concurrent repricing.
    t.integer('price_version').notNullable().defaultTo(0);
    t.timestamps(true, true);
    t.unique(['drink_id', 'size_id']);
  });

  await knex.schema.createTable('build_lines', (t) => {
    id(t); biz(t);
    t.uuid('drink_size_id').notNullable().references('drink_sizes.id').onDelete('CASCADE').index();
    lineColumns(t);
  });
  await lineChecks('build_lines');

  await knex.schema.createTable('menu_price_history', (t) => {
    id(t); biz(t);
    t.uuid('drink_size_id').notNullable().references('drink_sizes.id').onDelete('CASCADE').index();
    t.decimal('old_price', 14, 4);
    t.decimal('new_price', 14, 4).notNullable();
    t.date('effective_from').notNullable();
    t.text('reason');
    t.uuid('scenario_id');
    t.uuid('changed_by').references('users.id').onDelete('SET NULL');
    t.timestamp('changed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  // Add-ons and swaps, costed per cup size. A swap has remove lines (what it
  // replaces) and add lines; an add-on has only add lines.
  await knex.schema.createTable('modifiers', (t) => {
    id(t); biz(t);
    t.text('name').notNullable();
    t.string('kind', 6).notNullable().checkIn(['add', 'swap']);
    t.decimal('upcharge', 14, 4);
    t.timestamp('archived_at', { useTz: true });
    t.timestamps(true, true);
    t.unique(['business_id', 'name']);
  });
  await knex.schema.createTable('modifier_lines', (t) => {
    id(t); biz(t);
    t.uuid('modifier_id').notNullable().references('modifiers.id').onDelete('CASCADE').index();
    t.uuid('size_id').notNullable().references('cup_sizes.id').onDelete('CASCADE');
    t.string('action', 6).notNullable().defaultTo('add').checkIn(['add', 'remove']);
    lineColumns(t);
  });
  await lineChecks('modifier_lines');

  // One row with category null is the business's policy; other rows override it per drink category.
  await knex.schema.createTable('pricing_policies', (t) => {
    id(t); biz(t);
    t.text('category');
    t.decimal('target_margin_pct', 7, 4).notNullable();
    t.string('tax_mode', 10).notNullable().checkIn(['inclusive', 'exclusive']);
    t.decimal('tax_rate_pct', 7, 4).notNullable();
    t.decimal('price_step', 14, 4).notNullable();
    t.string('rounding', 8).notNullable().checkIn(['up', 'nearest', 'none']);
    t.timestamps(true, true);
  });
  await knex.raw('create unique index pricing_policies_one_per_category on pricing_policies (business_id, coalesce(category, \'\'))');
}

export async function down(knex: Knex) {
  for (const t of ['pricing_policies', 'modifier_lines', 'modifiers', 'menu_price_history', 'build_lines', 'drink_sizes', 'drinks', 'preparation_lines', 'measures', 'preparations', 'pack_prices']) {
    await knex.schema.dropTable(t);
  }
  await knex.schema.alterTable('ingredients', (t) => t.dropForeign(['costing_pack_id']));
  for (const t of ['packs', 'ingredients', 'suppliers', 'cup_sizes']) await knex.schema.dropTable(t);
}

import type { Knex } from 'knex';
import { suffix } from './factories';

// Small row factories for the costing tables: each call makes rows unique to it.

export async function makeSize(db: Knex, businessId: string, opts: { name?: string; volumeMl?: string; position?: number } = {}) {
  const [row] = await db('cup_sizes')
    .insert({ business_id: businessId, name: opts.name ?? `Size ${suffix()}`, volume_ml: opts.volumeMl ?? '341', position: opts.position ?? 0 })
    .returning('id');
  return row.id as string;
}

export async function makeSupplier(db: Knex, businessId: string, name = `Supplier ${suffix()}`) {
  const [row] = await db('suppliers').insert({ business_id: businessId, name, order_email: `orders-${suffix()}@supplier.test` }).returning('id');
  return row.id as string;
}

export interface IngredientOpts {
  name?: string;
  category?: string;
  baseUnit?: 'g' | 'ml' | 'each';
  density?: string | null;
  yieldPct?: string;
  allergens?: string[];
  pack?: { count?: string; quantity: string; unit: string; price: string; effectiveFrom?: string; supplierId?: string | null } | null;
  measures?: { name: string; quantity: string; unit: string }[];
}

/** An ingredient with (by default) one pack priced from 2020-01-01, and its measures by name. */
export async function makeIngredient(db: Knex, businessId: string, opts: IngredientOpts = {}) {
  const [ing] = await db('ingredients')
    .insert({
      business_id: businessId,
      name: opts.name ?? `Ingredient ${suffix()}`,
      category: opts.category ?? 'other',
      base_unit: opts.baseUnit ?? 'g',
      density_g_per_ml: opts.density ?? null,
      yield_pct: opts.yieldPct ?? '100',
      allergens: opts.allergens ?? [],
    })
    .returning('id');
  let packId: string | null = null;
  const pack = opts.pack === undefined ? { quantity: '1', unit: 'kg', price: '10' } : opts.pack;
  if (pack) {
    const [p] = await db('packs')
      .insert({ business_id: businessId, ingredient_id: ing.id, description: `Pack ${suffix()}`, count: pack.count ?? '1', quantity: pack.quantity, unit: pack.unit, supplier_id: pack.supplierId ?? null })
      .returning('id');
    packId = p.id;
    await db('pack_prices').insert({ business_id: businessId, pack_id: p.id, price: pack.price, effective_from: pack.effectiveFrom ?? '2020-01-01' });
  }
  const measures: Record<string, string> = {};
  for (const m of opts.measures ?? []) {
    const [row] = await db('measures').insert({ business_id: businessId, ingredient_id: ing.id, ...m }).returning('id');
    measures[m.name] = row.id;
  }
  return { id: ing.id as string, packId, measures };
}

export interface LineOpts {
  ingredientId?: string;
  preparationId?: string;
  quantity: string;
  unit?: string;
  measureId?: string;
}

const lineCols = (l: LineOpts, i: number) => ({
  position: i,
  ingredient_id: l.ingredientId ?? null,
  preparation_id: l.preparationId ?? null,
  quantity: l.quantity,
  unit: l.unit ?? null,
  measure_id: l.measureId ?? null,
});

export async function makePreparation(
  db: Knex,
  businessId: string,
  opts: { name?: string; yieldQuantity: string; yieldUnit: string; lines: LineOpts[]; measures?: { name: string; quantity: string; unit: string }[] },
) {
  const [p] = await db('preparations').insert({ business_id: businessId, name: opts.name ?? `Prep ${suffix()}`, yield_quantity: opts.yieldQuantity, yield_unit: opts.yieldUnit }).returning('id');
  if (opts.lines.length) await db('preparation_lines').insert(opts.lines.map((l, i) => ({ business_id: businessId, parent_id: p.id, ...lineCols(l, i) })));
  const measures: Record<string, string> = {};
  for (const m of opts.measures ?? []) {
    const [row] = await db('measures').insert({ business_id: businessId, preparation_id: p.id, ...m }).returning('id');
    measures[m.name] = row.id;
  }
  return { id: p.id as string, measures };
}

export async function makeDrink(
  db: Knex,
  businessId: string,
  opts: { name?: string; category?: string; temperature?: 'hot' | 'iced'; sizes: { sizeId: string; price?: string | null; lines: LineOpts[] }[] },
) {
  const [d] = await db('drinks')
    .insert({ business_id: businessId, name: opts.name ?? `Drink ${suffix()}`, category: opts.category ?? 'Espresso', temperature: opts.temperature ?? 'hot' })
    .returning('id');
  const drinkSizeIds: string[] = [];
  for (const s of opts.sizes) {
    const [ds] = await db('drink_sizes').insert({ business_id: businessId, drink_id: d.id, size_id: s.sizeId, price: s.price ?? null }).returning('id');
    drinkSizeIds.push(ds.id);
    if (s.lines.length) await db('build_lines').insert(s.lines.map((l, i) => ({ business_id: businessId, drink_size_id: ds.id, ...lineCols(l, i) })));
  }
  return { id: d.id as string, drinkSizeIds };
}

export async function makePolicy(
  db: Knex,
  businessId: string,
  p: { category?: string | null; targetMarginPct?: string; taxMode?: 'inclusive' | 'exclusive'; taxRatePct?: string; priceStep?: string; rounding?: 'up' | 'nearest' | 'none' } = {},
) {
  // Sets the policy: an earlier one for the same category (e.g. saved through the API) is replaced.
  await db('pricing_policies').where({ business_id: businessId }).whereRaw("coalesce(category, '') = ?", [p.category ?? '']).delete();
  await db('pricing_policies').insert({
    business_id: businessId,
    category: p.category ?? null,
    target_margin_pct: p.targetMarginPct ?? '72',
    tax_mode: p.taxMode ?? 'inclusive',
    tax_rate_pct: p.taxRatePct ?? '20',
    price_step: p.priceStep ?? '0.05',
    rounding: p.rounding ?? 'up',
  });
}

export async function makeModifier(db: Knex, businessId: string, opts: { name?: string; kind?: 'add' | 'swap'; lines: (LineOpts & { sizeId: string; action?: 'add' | 'remove' })[] }) {
  const [m] = await db('modifiers').insert({ business_id: businessId, name: opts.name ?? `Modifier ${suffix()}`, kind: opts.kind ?? 'add' }).returning('id');
  if (opts.lines.length) {
    await db('modifier_lines').insert(opts.lines.map((l, i) => ({ business_id: businessId, modifier_id: m.id, size_id: l.sizeId, action: l.action ?? 'add', ...lineCols(l, i) })));
  }
  return m.id as string;
}

/**
 * The documented preview example stored as rows: milk, beans (shot measure), sugar, a 12 oz
 * cup, the house syrup preparation (pump measure), one size "Regular" priced 3.45, and the
 * 72 % / 20 % inclusive / 0.05 up policy.
 */
export async function makeDocumentedDrink(db: Knex, businessId: string) {
  const milk = await makeIngredient(db, businessId, { name: `Milk ${suffix()}`, baseUnit: 'ml', density: '1.03', yieldPct: '92', allergens: ['milk'], pack: { count: '6', quantity: '2', unit: 'l', price: '9.90' } });
  const beans = await makeIngredient(db, businessId, { name: `Beans ${suffix()}`, baseUnit: 'g', yieldPct: '96', pack: { quantity: '1', unit: 'kg', price: '21.40' }, measures: [{ name: 'shot', quantity: '9', unit: 'g' }] });
  const sugar = await makeIngredient(db, businessId, { name: `Sugar ${suffix()}`, pack: { count: '10', quantity: '1', unit: 'kg', price: '11.90' } });
  const cup = await makeIngredient(db, businessId, { name: `Cup ${suffix()}`, baseUnit: 'each', category: 'packaging', pack: { count: '50', quantity: '20', unit: 'each', price: '61.50' } });
  const syrup = await makePreparation(db, businessId, {
    name: `House syrup ${suffix()}`,
    yieldQuantity: '1.25',
    yieldUnit: 'l',
    lines: [{ ingredientId: sugar.id, quantity: '1', unit: 'kg' }],
    measures: [{ name: 'pump', quantity: '7.5', unit: 'ml' }],
  });
  const sizeId = await makeSize(db, businessId, { name: `Regular ${suffix()}` });
  await makePolicy(db, businessId);
  const drink = await makeDrink(db, businessId, {
    sizes: [
      {
        sizeId,
        price: '3.45',
        lines: [
          { ingredientId: beans.id, quantity: '2', measureId: beans.measures.shot },
          { ingredientId: milk.id, quantity: '260', unit: 'ml' },
          { preparationId: syrup.id, quantity: '2', measureId: syrup.measures.pump },
          { ingredientId: cup.id, quantity: '1', unit: 'each' },
        ],
      },
    ],
  });
  return { milk, beans, sugar, cup, syrup, sizeId, drink };
}

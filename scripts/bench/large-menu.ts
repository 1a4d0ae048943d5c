import type { Knex } from 'knex';

/**
 * Seeds the large bench menu into a scratch database: 60 ingredients, 30
 * preparations nested up to 3 deep, 200 drinks × 4 sizes × 10 lines.
 * Deterministic (no randomness) so runs compare.
 */
export async function seedLargeMenu(db: Knex) {
  const [biz] = await db('businesses').insert({ name: 'Bench Café', country: 'GB', currency: 'GBP', tax_mode: 'inclusive' }).returning('id');
  const businessId: string = biz.id;
  await db('sites').insert({ business_id: businessId, name: 'Bench Site' });
  await db('pricing_policies').insert({ business_id: businessId, category: null, target_margin_pct: '72', tax_mode: 'inclusive', tax_rate_pct: '20', price_step: '0.05', rounding: 'up' });
  const sizes = await db('cup_sizes')
    .insert(['S', 'M', 'L', 'XL'].map((name, i) => ({ business_id: businessId, name, volume_ml: String(227 + i * 114), position: i })))
    .returning('id');
  const [supplier] = await db('suppliers').insert({ business_id: businessId, name: 'Bench Supplier' }).returning('id');

  const units = [
    { base: 'ml', unit: 'l', qty: '2', cat: 'dairy' },
    { base: 'g', unit: 'kg', qty: '1', cat: 'coffee' },
    { base: 'ml', unit: 'l', qty: '1', cat: 'syrup-sauce' },
    { base: 'each', unit: 'each', qty: '50', cat: 'packaging' },
  ] as const;
  const ingredients = await db('ingredients')
    .insert(Array.from({ length: 60 }, (_, i) => {
      const u = units[i % units.length];
      return { business_id: businessId, name: `Ingredient ${i}`, category: u.cat, base_unit: u.base, yield_pct: String(90 + (i % 10)), density_g_per_ml: u.base === 'ml' ? '1.03' : null };
    }))
    .returning(['id', 'base_unit']);
  const packs = await db('packs')
    .insert(ingredients.map((ing, i) => {
      const u = units[i % units.length];
      return { business_id: businessId, ingredient_id: ing.id, supplier_id: supplier.id, description: `Pack ${i}`, count: String(1 + (i % 6)), quantity: u.qty, unit: u.unit };
    }))
    .returning(['id', 'ingredient_id']);
  await db('pack_prices').insert(packs.map((p, i) => ({ business_id: businessId, pack_id: p.id, price: (5 + (i % 17) * 1.37).toFixed(2), effective_from: '2026-01-01', source: 'seed' })));
  for (const p of packs) await db('ingredients').where({ id: p.ingredient_id }).update({ costing_pack_id: p.id });

  // Preparations in three tiers: tier 0 uses ingredients, tier 1 also tier 0, tier 2 also tier 1.
  const preps: { id: string; tier: number }[] = [];
  for (let i = 0; i < 30; i++) {
    const tier = i < 12 ? 0 : i < 22 ? 1 : 2;
    const [p] = await db('preparations').insert({ business_id: businessId, name: `Preparation ${i}`, yield_quantity: '1.5', yield_unit: 'l', density_g_per_ml: '1.1' }).returning('id');
    const lines: Record<string, unknown>[] = [];
    for (let k = 0; k < 4; k++) {
      const ing = ingredients[(i * 7 + k * 3) % ingredients.length];
      lines.push({ business_id: businessId, parent_id: p.id, position: k, ingredient_id: ing.id, quantity: '100', unit: ing.base_unit === 'each' ? 'each' : ing.base_unit });
    }
    if (tier > 0) {
      const below = preps.filter((x) => x.tier === tier - 1);
      lines.push({ business_id: businessId, parent_id: p.id, position: 9, preparation_id: below[i % below.length].id, quantity: '200', unit: 'ml' });
    }
    await db('preparation_lines').insert(lines);
    preps.push({ id: p.id, tier });
  }

  const drinks = await db('drinks')
    .insert(Array.from({ length: 200 }, (_, i) => ({ business_id: businessId, name: `Drink ${i}`, category: ['Espresso', 'Tea', 'Chocolate', 'Iced'][i % 4], temperature: i % 4 === 3 ? 'iced' : 'hot' })))
    .returning('id');
  const drinkSizes = await db('drink_sizes')
    .insert(drinks.flatMap((d, i) => sizes.map((s, k) => ({ business_id: businessId, drink_id: d.id, size_id: s.id, price: (2.8 + k * 0.4 + (i % 5) * 0.1).toFixed(2) }))))
    .returning('id');
  const lines: Record<string, unknown>[] = [];
  drinkSizes.forEach((ds, n) => {
    for (let k = 0; k < 10; k++) {
      if (k === 9) {
        lines.push({ business_id: businessId, drink_size_id: ds.id, position: k, preparation_id: preps[(n + k) % preps.length].id, quantity: String(10 + (n % 4) * 5), unit: 'ml' });
      } else {
        const ing = ingredients[(n * 3 + k * 7) % ingredients.length];
        lines.push({ business_id: businessId, drink_size_id: ds.id, position: k, ingredient_id: ing.id, quantity: ing.base_unit === 'each' ? '1' : String(5 + ((n + k) % 20) * 3), unit: ing.base_unit });
      }
    }
  });
  for (let i = 0; i < lines.length; i += 2000) await db('build_lines').insert(lines.slice(i, i + 2000));
  return { businessId, drinks: drinks.length, sizes: drinkSizes.length, lines: lines.length, preparations: preps.length };
}

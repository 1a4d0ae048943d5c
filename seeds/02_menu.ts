import type { Knex } from 'knex';
import { isUnitCode } from '../src/shared/units';
import { DEMO } from './01_tenancy';

// The invented café's menu: cup sizes, three invented suppliers, about forty ingredients with
// packs and prices, three preparations (one nested in another), twenty-odd drinks with a build
// per size, modifiers and a pricing policy; and a small menu for the second (US) business.
// Prices are invented for the demo. Densities come from USDA FoodData Central (see
// tests/SOURCES.md, secondary); pump and shot sizes are common practice, no source.

const id = (n: number) => `0d1e6a52-5f0c-4c3a-9a51-1c7a2f${String(n).padStart(6, '0')}`;

/** Rows later seeds (purchase orders, stock counts) refer to. */
export const MENU_IDS = {
  suppliers: { dairy: id(101), roaster: id(102), wholesaler: id(103), otherWholesaler: id(104) },
  ingredients: { wholeMilk: id(201), espressoBeans: id(202), oatDrink: id(203), cup12: id(204) },
  packs: { wholeMilk: id(301), espressoBeans: id(302), oatDrink: id(303), cup12: id(304) },
  sizes: { small: id(401), regular: id(402), large: id(403) },
};

const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

type Unit = string;
interface IngredientSeed {
  id?: string;
  packId?: string;
  name: string;
  category: string;
  base: 'g' | 'ml' | 'each';
  density?: string;
  yieldPct?: string;
  allergens?: string[];
  supplier: string;
  pack: [description: string, count: string, quantity: string, unit: Unit, price: string];
  measures?: [name: string, quantity: string, unit: Unit][];
  notes?: string;
  /** Earlier prices of the pack, oldest first: [price, days ago]. */
  history?: [string, number][];
}
type Line = [item: string, quantity: string, unitOrMeasure: string];
interface PrepSeed {
  name: string;
  yield: [string, Unit];
  lines: Line[];
  measures?: [string, string, Unit][];
  method: string;
}
interface DrinkSeed {
  name: string;
  category: string;
  temperature: 'hot' | 'iced';
  sizes: Record<string, { price: string; lines: Line[] }>;
}

async function clear(knex: Knex, businessIds: string[]) {
  // Children first: build and preparation lines restrict deleting what they use.
  for (const t of ['drinks', 'modifiers', 'preparation_lines', 'measures', 'preparations', 'ingredients', 'cup_sizes', 'suppliers', 'pricing_policies']) {
    await knex(t).whereIn('business_id', businessIds).delete();
  }
}

async function insertMenu(
  knex: Knex,
  businessId: string,
  data: {
    sizes: { id?: string; name: string; volumeMl: string; position: number }[];
    suppliers: { id: string; key: string; name: string; contact: string; email: string; phone: string; terms: 'card' | 'account'; days: number[] }[];
    ingredients: IngredientSeed[];
    preparations: PrepSeed[];
    drinks: DrinkSeed[];
    modifiers: { name: string; kind: 'add' | 'swap'; upcharge: string; lines: Record<string, { add?: Line[]; remove?: Line[] }> }[];
    policy: { target: string; mode: 'inclusive' | 'exclusive'; tax: string; step: string; rounding: 'up' | 'nearest' | 'none' };
    overrides?: { category: string; target: string }[];
  },
) {
  const sizeIds = new Map<string, string>();
  for (const s of data.sizes) {
    const [row] = await knex('cup_sizes').insert({ ...(s.id ? { id: s.id } : {}), business_id: businessId, name: s.name, volume_ml: s.volumeMl, position: s.position }).returning('id');
    sizeIds.set(s.name, row.id);
  }
  const supplierIds = new Map<string, string>();
  for (const s of data.suppliers) {
    await knex('suppliers').insert({ id: s.id, business_id: businessId, name: s.name, contact_name: s.contact, order_email: s.email, phone: s.phone, payment_terms: s.terms, delivery_days: s.days });
    supplierIds.set(s.key, s.id);
  }
  const items = new Map<string, string>();
  const measures = new Map<string, string>();
  for (const ing of data.ingredients) {
    const [row] = await knex('ingredients')
      .insert({
        ...(ing.id ? { id: ing.id } : {}),
        business_id: businessId,
        name: ing.name,
        category: ing.category,
        base_unit: ing.base,
        density_g_per_ml: ing.density ?? null,
        yield_pct: ing.yieldPct ?? '100',
        allergens: ing.allergens ?? [],
        notes: ing.notes ?? null,
      })
      .returning('id');
    items.set(ing.name, row.id);
    const [description, count, quantity, unit, price] = ing.pack;
    const [pack] = await knex('packs')
      .insert({ ...(ing.packId ? { id: ing.packId } : {}), business_id: businessId, ingredient_id: row.id, supplier_id: supplierIds.get(ing.supplier), description, count, quantity, unit })
      .returning('id');
    const prices = [...(ing.history ?? []), [price, 30] as [string, number]];
    await knex('pack_prices').insert(prices.map(([p, ago]) => ({ business_id: businessId, pack_id: pack.id, price: p, effective_from: daysAgo(ago), source: 'seed' })));
    for (const [name, q, u] of ing.measures ?? []) {
      const [m] = await knex('measures').insert({ business_id: businessId, ingredient_id: row.id, name, quantity: q, unit: u }).returning('id');
      measures.set(`${ing.name}/${name}`, m.id);
    }
  }
  const line = (l: Line, position: number) => {
    const [item, quantity, unit] = l;
    const itemId = items.get(item);
    if (!itemId) throw new Error(`seed: unknown item ${item}`);
    const isPrep = !data.ingredients.some((i) => i.name === item);
    const measureId = isUnitCode(unit) ? null : measures.get(`${item}/${unit}`);
    if (measureId === undefined) throw new Error(`seed: unknown measure ${item}/${unit}`);
    return { position, ingredient_id: isPrep ? null : itemId, preparation_id: isPrep ? itemId : null, quantity, unit: measureId ? null : unit, measure_id: measureId };
  };
  // Preparations in order: a later one may use an earlier one.
  for (const p of data.preparations) {
    const [row] = await knex('preparations').insert({ business_id: businessId, name: p.name, yield_quantity: p.yield[0], yield_unit: p.yield[1], method: p.method }).returning('id');
    await knex('preparation_lines').insert(p.lines.map((l, i) => ({ business_id: businessId, parent_id: row.id, ...line(l, i) })));
    items.set(p.name, row.id);
    for (const [name, q, u] of p.measures ?? []) {
      const [m] = await knex('measures').insert({ business_id: businessId, preparation_id: row.id, name, quantity: q, unit: u }).returning('id');
      measures.set(`${p.name}/${name}`, m.id);
    }
  }
  for (const d of data.drinks) {
    const [row] = await knex('drinks').insert({ business_id: businessId, name: d.name, category: d.category, temperature: d.temperature }).returning('id');
    for (const [sizeName, s] of Object.entries(d.sizes)) {
      const [ds] = await knex('drink_sizes').insert({ business_id: businessId, drink_id: row.id, size_id: sizeIds.get(sizeName), price: s.price }).returning('id');
      await knex('menu_price_history').insert({ business_id: businessId, drink_size_id: ds.id, old_price: null, new_price: s.price, effective_from: daysAgo(60), reason: 'Opening menu' });
      await knex('build_lines').insert(s.lines.map((l, i) => ({ business_id: businessId, drink_size_id: ds.id, ...line(l, i) })));
    }
  }
  for (const m of data.modifiers) {
    const [row] = await knex('modifiers').insert({ business_id: businessId, name: m.name, kind: m.kind, upcharge: m.upcharge }).returning('id');
    const rows = Object.entries(m.lines).flatMap(([sizeName, ls]) => [
      ...(ls.remove ?? []).map((l, i) => ({ size_id: sizeIds.get(sizeName), action: 'remove', ...line(l, i) })),
      ...(ls.add ?? []).map((l, i) => ({ size_id: sizeIds.get(sizeName), action: 'add', ...line(l, 100 + i) })),
    ]);
    await knex('modifier_lines').insert(rows.map((r) => ({ business_id: businessId, modifier_id: row.id, ...r })));
  }
  const pol = data.policy;
  await knex('pricing_policies').insert([
    { business_id: businessId, category: null, target_margin_pct: pol.target, tax_mode: pol.mode, tax_rate_pct: pol.tax, price_step: pol.step, rounding: pol.rounding },
    ...(data.overrides ?? []).map((o) => ({ business_id: businessId, category: o.category, target_margin_pct: o.target, tax_mode: pol.mode, tax_rate_pct: pol.tax, price_step: pol.step, rounding: pol.rounding })),
  ]);
}

// ---- Lantern Row Coffee (GB, GBP, VAT-inclusive menu prices at 20 %) ----

const S = 'Small';
const R = 'Regular';
const L = 'Large';
const hotPack = (size: string): Line[] => [
  [size === S ? '8 oz hot cup' : size === R ? '12 oz hot cup' : '16 oz hot cup', '1', 'each'],
  [size === S ? 'Hot lid, 8 oz' : 'Hot lid, 12/16 oz', '1', 'each'],
  ...(size === S ? [] : ([['Cup sleeve', '1', 'each']] as Line[])),
];
const coldPack = (size: string, dome = false): Line[] => [
  [size === L ? '16 oz cold cup' : '12 oz cold cup', '1', 'each'],
  [dome ? 'Dome lid' : 'Flat cold lid', '1', 'each'],
  ['Paper straw', '1', 'each'],
];
const shots = (n: string, decaf = false): Line => [decaf ? 'Decaf espresso beans' : 'House espresso beans', n, 'shot'];
const SHOTS: Record<string, string> = { [S]: '2', [R]: '2', [L]: '3' };

/** A drink offered in Small, Regular and Large from one build function and three prices. */
const three = (name: string, category: string, temperature: 'hot' | 'iced', prices: [string, string, string], build: (size: string, i: number) => Line[]): DrinkSeed => ({
  name,
  category,
  temperature,
  sizes: Object.fromEntries([S, R, L].map((size, i) => [size, { price: prices[i], lines: build(size, i) }])),
});
const pick = <T>(i: number, values: [T, T, T]) => values[i];

const gbIngredients: IngredientSeed[] = [
  { id: MENU_IDS.ingredients.espressoBeans, packId: MENU_IDS.packs.espressoBeans, name: 'House espresso beans', category: 'coffee', base: 'g', yieldPct: '96', supplier: 'roaster', pack: ['Lantern blend, 1 kg bag', '1', '1', 'kg', '21.40'], measures: [['shot', '9', 'g']], notes: 'Yield allows for purge and grinder retention.' },
  { name: 'Decaf espresso beans', category: 'coffee', base: 'g', yieldPct: '96', supplier: 'roaster', pack: ['Swiss water decaf, 1 kg bag', '1', '1', 'kg', '24.60'], measures: [['shot', '9', 'g']] },
  { name: 'Coarse cold brew grind', category: 'coffee', base: 'g', supplier: 'roaster', pack: ['Cold brew grind, 2.5 kg', '1', '2.5', 'kg', '44.50'] },
  { id: MENU_IDS.ingredients.wholeMilk, packId: MENU_IDS.packs.wholeMilk, name: 'Whole milk', category: 'dairy', base: 'ml', density: '1.0313', yieldPct: '92', allergens: ['milk'], supplier: 'dairy', pack: ['Whole milk, 6 × 2 l', '6', '2', 'l', '9.90'], history: [['9.30', 200]], notes: 'Yield allows for milk left in the pitcher.' },
  { name: 'Semi-skimmed milk', category: 'dairy', base: 'ml', density: '1.033', yieldPct: '92', allergens: ['milk'], supplier: 'dairy', pack: ['Semi-skimmed, 6 × 2 l', '6', '2', 'l', '9.60'] },
  { name: 'Double cream', category: 'dairy', base: 'ml', yieldPct: '95', allergens: ['milk'], supplier: 'dairy', pack: ['Double cream, 1 l', '1', '1', 'l', '4.20'] },
  { id: MENU_IDS.ingredients.oatDrink, packId: MENU_IDS.packs.oatDrink, name: 'Oat drink', category: 'plant-milk', base: 'ml', density: '1.0144', yieldPct: '94', allergens: ['cereals-containing-gluten'], supplier: 'wholesaler', pack: ['Barista oat, 6 × 1 l', '6', '1', 'l', '12.00'], notes: 'Oats: check the supplier specification for gluten.' },
  { name: 'Soy drink', category: 'plant-milk', base: 'ml', density: '1.0271', yieldPct: '94', allergens: ['soybeans'], supplier: 'wholesaler', pack: ['Barista soy, 6 × 1 l', '6', '1', 'l', '10.20'] },
  { name: 'Almond drink', category: 'plant-milk', base: 'ml', yieldPct: '94', allergens: ['tree-nuts'], supplier: 'wholesaler', pack: ['Barista almond, 6 × 1 l', '6', '1', 'l', '13.80'] },
  { name: 'Coconut drink', category: 'plant-milk', base: 'ml', yieldPct: '94', supplier: 'wholesaler', pack: ['Coconut drink, 6 × 1 l', '6', '1', 'l', '12.60'] },
  { name: 'Caramel syrup', category: 'syrup-sauce', base: 'ml', yieldPct: '97', supplier: 'wholesaler', pack: ['Caramel syrup, 1 l bottle', '1', '1', 'l', '6.50'], measures: [['pump', '7.5', 'ml']] },
  { name: 'Hazelnut syrup', category: 'syrup-sauce', base: 'ml', yieldPct: '97', supplier: 'wholesaler', pack: ['Hazelnut flavour syrup, 1 l', '1', '1', 'l', '6.50'], measures: [['pump', '7.5', 'ml']], notes: 'Flavouring only per the supplier sheet: confirm no nut content at each delivery.' },
  { name: 'Dark chocolate sauce', category: 'syrup-sauce', base: 'ml', yieldPct: '95', allergens: ['milk', 'soybeans'], supplier: 'wholesaler', pack: ['Chocolate sauce, 2 l', '1', '2', 'l', '14.80'], measures: [['pump', '15', 'ml']] },
  { name: 'White chocolate sauce', category: 'syrup-sauce', base: 'ml', yieldPct: '95', allergens: ['milk'], supplier: 'wholesaler', pack: ['White chocolate sauce, 2 l', '1', '2', 'l', '16.20'], measures: [['pump', '15', 'ml']] },
  { name: 'Honey', category: 'syrup-sauce', base: 'g', density: '1.4329', yieldPct: '97', supplier: 'wholesaler', pack: ['Runny honey, 12 × 340 g', '12', '340', 'g', '28.80'], measures: [['squeeze', '10', 'g']] },
  { name: 'Caster sugar', category: 'other', base: 'g', supplier: 'wholesaler', pack: ['Caster sugar, 10 × 1 kg', '10', '1', 'kg', '11.90'] },
  { name: 'Vanilla extract', category: 'other', base: 'ml', supplier: 'wholesaler', pack: ['Vanilla extract, 500 ml', '1', '500', 'ml', '18.50'] },
  { name: 'Filtered water', category: 'other', base: 'ml', supplier: 'wholesaler', pack: ['Metered water and filter, per 1000 l', '1', '1000', 'l', '3.40'] },
  { name: 'Drinking chocolate', category: 'powder', base: 'g', allergens: ['milk'], supplier: 'wholesaler', pack: ['Drinking chocolate, 1 kg', '1', '1', 'kg', '12.00'], measures: [['scoop', '28', 'g']] },
  { name: 'Matcha powder', category: 'powder', base: 'g', supplier: 'wholesaler', pack: ['Culinary matcha, 100 g', '1', '100', 'g', '16.50'], measures: [['scoop', '3', 'g']] },
  { name: 'Frappé base', category: 'powder', base: 'g', allergens: ['milk'], supplier: 'wholesaler', pack: ['Blended drink base, 1 kg', '1', '1', 'kg', '14.40'], measures: [['scoop', '30', 'g']] },
  { name: 'Ground cinnamon', category: 'powder', base: 'g', supplier: 'wholesaler', pack: ['Ground cinnamon, 400 g', '1', '400', 'g', '7.20'] },
  { name: 'Breakfast tea bags', category: 'tea', base: 'each', supplier: 'wholesaler', pack: ['Breakfast tea, 300 bags', '1', '300', 'each', '14.70'] },
  { name: 'Earl grey tea bags', category: 'tea', base: 'each', supplier: 'wholesaler', pack: ['Earl grey, 100 bags', '1', '100', 'each', '6.40'] },
  { name: 'Peppermint tea bags', category: 'tea', base: 'each', supplier: 'wholesaler', pack: ['Peppermint, 100 bags', '1', '100', 'each', '6.10'] },
  { name: 'Assam leaf tea', category: 'tea', base: 'g', supplier: 'wholesaler', pack: ['Assam loose leaf, 1 kg', '1', '1', 'kg', '22.00'] },
  { name: 'Chai spice blend', category: 'tea', base: 'g', supplier: 'wholesaler', pack: ['Whole chai spices, 500 g', '1', '500', 'g', '16.00'] },
  { name: 'Ice', category: 'extras', base: 'g', supplier: 'wholesaler', pack: ['Ice cubes, 10 kg bag', '1', '10', 'kg', '2.50'] },
  { name: 'Mini marshmallows', category: 'extras', base: 'g', supplier: 'wholesaler', pack: ['Mini marshmallows, 1 kg', '1', '1', 'kg', '7.80'] },
  { name: '8 oz hot cup', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['8 oz cups, 50 × 20', '50', '20', 'each', '52.00'] },
  { id: MENU_IDS.ingredients.cup12, packId: MENU_IDS.packs.cup12, name: '12 oz hot cup', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['12 oz cups, 50 × 20', '50', '20', 'each', '61.50'] },
  { name: '16 oz hot cup', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['16 oz cups, 50 × 20', '50', '20', 'each', '72.00'] },
  { name: 'Hot lid, 8 oz', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['8 oz lids, 10 × 100', '10', '100', 'each', '38.00'] },
  { name: 'Hot lid, 12/16 oz', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['12/16 oz lids, 10 × 100', '10', '100', 'each', '42.00'] },
  { name: 'Cup sleeve', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['Sleeves, 10 × 100', '10', '100', 'each', '24.00'] },
  { name: '12 oz cold cup', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['12 oz clear cups, 20 × 50', '20', '50', 'each', '46.00'] },
  { name: '16 oz cold cup', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['16 oz clear cups, 20 × 50', '20', '50', 'each', '54.00'] },
  { name: 'Flat cold lid', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['Flat lids, 10 × 100', '10', '100', 'each', '30.00'] },
  { name: 'Dome lid', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['Dome lids, 10 × 100', '10', '100', 'each', '36.00'] },
  { name: 'Paper straw', category: 'packaging', base: 'each', supplier: 'wholesaler', pack: ['Paper straws, 10 × 250', '10', '250', 'each', '28.00'] },
];

const gbPreparations: PrepSeed[] = [
  {
    name: 'House vanilla syrup',
    // 1 kg sugar + 1 kg water makes about 1.63 l (a 1:1 syrup is 1.2296 g/ml, CRC, secondary).
    yield: ['1.6', 'l'],
    lines: [['Caster sugar', '1', 'kg'], ['Filtered water', '1', 'l'], ['Vanilla extract', '15', 'ml']],
    measures: [['pump', '7.5', 'ml']],
    method: 'Dissolve the sugar in the hot water, cool, stir in the vanilla. Label with the date; keep chilled.',
  },
  {
    name: 'Cold brew concentrate',
    yield: ['1.5', 'l'],
    lines: [['Coarse cold brew grind', '250', 'g'], ['Filtered water', '2', 'l']],
    method: 'Steep 16 hours chilled, filter twice. Keep chilled; use within the days your food safety plan allows.',
  },
  {
    name: 'Chai concentrate',
    yield: ['2', 'l'],
    lines: [['Assam leaf tea', '60', 'g'], ['Chai spice blend', '40', 'g'], ['House vanilla syrup', '300', 'ml'], ['Filtered water', '2', 'l']],
    method: 'Simmer the spices 10 minutes, steep the tea 5 minutes, strain, sweeten with house vanilla syrup. Cool quickly; keep chilled.',
  },
];

const latteBuild = (extra: (size: string, i: number) => Line[], milk: [string, string, string], milkName = 'Whole milk') => (size: string, i: number): Line[] => [
  shots(SHOTS[size]),
  [milkName, pick(i, milk), 'ml'],
  ...extra(size, i),
  ...hotPack(size),
];

const gbDrinks: DrinkSeed[] = [
  three('Americano', 'Espresso', 'hot', ['2.60', '2.90', '3.20'], (size, i) => [shots(SHOTS[size]), ['Filtered water', pick(i, ['160', '260', '340']), 'ml'], ...hotPack(size)]),
  three('Latte', 'Espresso', 'hot', ['3.10', '3.45', '3.80'], latteBuild(() => [], ['180', '260', '340'])),
  three('Cappuccino', 'Espresso', 'hot', ['3.10', '3.45', '3.80'], latteBuild(() => [['Ground cinnamon', '0.2', 'g']], ['150', '220', '290'])),
  three('Flat white', 'Espresso', 'hot', ['3.20', '3.50', '3.85'], latteBuild(() => [], ['120', '190', '260'])),
  three('Mocha', 'Espresso', 'hot', ['3.40', '3.80', '4.15'], latteBuild((_s, i) => [['Dark chocolate sauce', pick(i, ['1', '2', '2']), 'pump']], ['160', '230', '300'])),
  three('Caramel latte', 'Espresso', 'hot', ['3.50', '3.85', '4.20'], latteBuild((_s, i) => [['Caramel syrup', pick(i, ['2', '3', '4']), 'pump']], ['170', '250', '330'])),
  three('Vanilla latte', 'Espresso', 'hot', ['3.45', '3.80', '4.15'], latteBuild((_s, i) => [['House vanilla syrup', pick(i, ['2', '3', '4']), 'pump']], ['170', '250', '330'])),
  // Priced like a plain latte though oat and honey cost more: deliberately below target.
  three('Oat honey latte', 'Espresso', 'hot', ['3.10', '3.45', '3.80'], latteBuild((_s, i) => [['Honey', pick(i, ['1', '1.5', '2']), 'squeeze']], ['180', '260', '340'], 'Oat drink')),
  three('Breakfast tea', 'Tea', 'hot', ['2.20', '2.40', '2.60'], (size, i) => [['Breakfast tea bags', pick(i, ['1', '1', '2']), 'each'], ['Filtered water', pick(i, ['200', '300', '400']), 'ml'], ['Semi-skimmed milk', pick(i, ['20', '30', '40']), 'ml'], ...hotPack(size)]),
  three('Earl grey', 'Tea', 'hot', ['2.20', '2.40', '2.60'], (size, i) => [['Earl grey tea bags', pick(i, ['1', '1', '2']), 'each'], ['Filtered water', pick(i, ['200', '300', '400']), 'ml'], ...hotPack(size)]),
  three('Peppermint tea', 'Tea', 'hot', ['2.20', '2.40', '2.60'], (size, i) => [['Peppermint tea bags', pick(i, ['1', '1', '2']), 'each'], ['Filtered water', pick(i, ['200', '300', '400']), 'ml'], ...hotPack(size)]),
  // Priced below target on purpose: the concentrate and milk cost more than the price allows.
  three('Chai latte', 'Tea', 'hot', ['2.80', '3.00', '3.20'], (size, i) => [['Chai concentrate', pick(i, ['60', '90', '120']), 'ml'], ['Whole milk', pick(i, ['160', '240', '320']), 'ml'], ...hotPack(size)]),
  three('Matcha latte', 'Tea', 'hot', ['3.20', '3.50', '3.80'], (size, i) => [['Matcha powder', pick(i, ['1', '1', '1.5']), 'scoop'], ['Whole milk', pick(i, ['200', '290', '380']), 'ml'], ['House vanilla syrup', pick(i, ['1', '2', '2']), 'pump'], ...hotPack(size)]),
  three('Hot chocolate', 'Chocolate', 'hot', ['3.00', '3.30', '3.60'], (size, i) => [['Drinking chocolate', pick(i, ['1', '1.5', '2']), 'scoop'], ['Whole milk', pick(i, ['200', '290', '380']), 'ml'], ...hotPack(size)]),
  three('White hot chocolate', 'Chocolate', 'hot', ['3.20', '3.50', '3.80'], (size, i) => [['White chocolate sauce', pick(i, ['2', '3', '4']), 'pump'], ['Whole milk', pick(i, ['190', '280', '360']), 'ml'], ...hotPack(size)]),
  // Cream and marshmallows on top at the plain price: below target.
  three('Hot chocolate with cream', 'Chocolate', 'hot', ['3.20', '3.50', '3.80'], (size, i) => [['Drinking chocolate', pick(i, ['1', '1.5', '2']), 'scoop'], ['Whole milk', pick(i, ['180', '260', '340']), 'ml'], ['Double cream', pick(i, ['30', '40', '50']), 'ml'], ['Mini marshmallows', pick(i, ['5', '8', '10']), 'g'], ...hotPack(size)]),
  three('Iced latte', 'Iced', 'iced', ['3.20', '3.55', '3.90'], (size, i) => [shots(SHOTS[size]), ['Whole milk', pick(i, ['150', '200', '260']), 'ml'], ['Ice', pick(i, ['120', '160', '200']), 'g'], ...coldPack(size)]),
  three('Iced americano', 'Iced', 'iced', ['2.80', '3.10', '3.40'], (size, i) => [shots(SHOTS[size]), ['Filtered water', pick(i, ['120', '170', '220']), 'ml'], ['Ice', pick(i, ['120', '160', '200']), 'g'], ...coldPack(size)]),
  three('Iced vanilla cold brew', 'Iced', 'iced', ['3.40', '3.70', '4.00'], (size, i) => [['Cold brew concentrate', pick(i, ['80', '110', '140']), 'ml'], ['Filtered water', pick(i, ['80', '110', '140']), 'ml'], ['House vanilla syrup', pick(i, ['2', '3', '4']), 'pump'], ['Ice', pick(i, ['120', '160', '200']), 'g'], ...coldPack(size)]),
  three('Iced chai latte', 'Iced', 'iced', ['3.30', '3.60', '3.90'], (size, i) => [['Chai concentrate', pick(i, ['60', '90', '120']), 'ml'], ['Whole milk', pick(i, ['120', '170', '220']), 'ml'], ['Ice', pick(i, ['120', '160', '200']), 'g'], ...coldPack(size)]),
  three('Caramel frappé', 'Blended', 'iced', ['3.90', '4.30', '4.70'], (size, i) => [
    ['Frappé base', pick(i, ['1', '1.5', '2']), 'scoop'],
    shots(pick(i, ['1', '1', '2'])),
    ['Whole milk', pick(i, ['120', '170', '220']), 'ml'],
    ['Caramel syrup', pick(i, ['2', '3', '4']), 'pump'],
    ['Ice', pick(i, ['150', '200', '250']), 'g'],
    ['Double cream', pick(i, ['30', '40', '50']), 'ml'],
    ...coldPack(size, true),
  ]),
];

const perSize = <T>(f: (size: string, i: number) => T): Record<string, T> => Object.fromEntries([S, R, L].map((s, i) => [s, f(s, i)]));
const latteMilk: [string, string, string] = ['180', '260', '340'];

export async function seed(knex: Knex) {
  await clear(knex, [DEMO.businessId, DEMO.otherBusinessId]);

  await insertMenu(knex, DEMO.businessId, {
    sizes: [
      { id: MENU_IDS.sizes.small, name: S, volumeMl: '227', position: 1 },
      { id: MENU_IDS.sizes.regular, name: R, volumeMl: '341', position: 2 },
      { id: MENU_IDS.sizes.large, name: L, volumeMl: '455', position: 3 },
    ],
    suppliers: [
      { id: MENU_IDS.suppliers.dairy, key: 'dairy', name: 'Meadowgate Dairy', contact: 'Hollis Penrose', email: 'orders@meadowgate-dairy.test', phone: '01632 960101', terms: 'account', days: [1, 3, 5] },
      { id: MENU_IDS.suppliers.roaster, key: 'roaster', name: 'Ridgeback Roasting Co.', contact: 'Marisol Teague', email: 'orders@ridgeback-roasting.test', phone: '01632 960202', terms: 'card', days: [2] },
      { id: MENU_IDS.suppliers.wholesaler, key: 'wholesaler', name: 'Harbourline Café Supplies', contact: 'Dev Anand Lowry', email: 'orders@harbourline-supplies.test', phone: '01632 960303', terms: 'account', days: [2, 4] },
    ],
    ingredients: gbIngredients,
    preparations: gbPreparations,
    drinks: gbDrinks,
    modifiers: [
      { name: 'Extra shot', kind: 'add', upcharge: '0.60', lines: perSize(() => ({ add: [shots('1')] })) },
      { name: 'Decaf', kind: 'swap', upcharge: '0.00', lines: perSize((s) => ({ remove: [shots(SHOTS[s])], add: [shots(SHOTS[s], true)] })) },
      { name: 'Oat drink instead of milk', kind: 'swap', upcharge: '0.40', lines: perSize((_s, i) => ({ remove: [['Whole milk', latteMilk[i], 'ml']], add: [['Oat drink', latteMilk[i], 'ml']] })) },
      { name: 'Soy drink instead of milk', kind: 'swap', upcharge: '0.40', lines: perSize((_s, i) => ({ remove: [['Whole milk', latteMilk[i], 'ml']], add: [['Soy drink', latteMilk[i], 'ml']] })) },
      { name: 'Syrup pump', kind: 'add', upcharge: '0.40', lines: perSize(() => ({ add: [['House vanilla syrup', '1', 'pump']] })) },
    ],
    policy: { target: '72', mode: 'inclusive', tax: '20', step: '0.05', rounding: 'up' },
    overrides: [{ category: 'Tea', target: '78' }],
  });

  // ---- Bright Hollow Café (US, USD, sales tax added at the till) ----
  await insertMenu(knex, DEMO.otherBusinessId, {
    sizes: [
      { name: '8 oz', volumeMl: '236.59', position: 1 },
      { name: '12 oz', volumeMl: '354.88', position: 2 },
      { name: '16 oz', volumeMl: '473.18', position: 3 },
    ],
    suppliers: [{ id: MENU_IDS.suppliers.otherWholesaler, key: 'main', name: 'Brightwater Provisions', contact: 'Juniper Castell', email: 'orders@brightwater-provisions.test', phone: '555-0142', terms: 'card', days: [1, 4] }],
    ingredients: [
      { name: 'Espresso beans', category: 'coffee', base: 'g', yieldPct: '96', supplier: 'main', pack: ['5 lb bag', '1', '5', 'lb', '62.00'], measures: [['shot', '9', 'g']] },
      // 1 US gal of milk at $4.29 (the trade-checks test case, HB44 gallon).
      { name: 'Whole milk', category: 'dairy', base: 'ml', density: '1.0313', yieldPct: '92', allergens: ['milk'], supplier: 'main', pack: ['1 gal jug', '1', '1', 'gal_us', '4.29'] },
      { name: 'Oat drink', category: 'plant-milk', base: 'ml', yieldPct: '94', allergens: ['cereals-containing-gluten'], supplier: 'main', pack: ['6 × 64 fl oz', '6', '64', 'fl_oz_us', '27.00'] },
      // A pump is about a quarter of a US fl oz (common practice, no source).
      { name: 'Vanilla syrup', category: 'syrup-sauce', base: 'ml', yieldPct: '97', supplier: 'main', pack: ['750 ml bottle', '1', '750', 'ml', '8.50'], measures: [['pump', '0.25', 'fl_oz_us']] },
      { name: 'Hot water', category: 'other', base: 'ml', supplier: 'main', pack: ['Metered water, 1000 gal', '1', '1000', 'gal_us', '9.00'] },
      { name: '8 oz cup', category: 'packaging', base: 'each', supplier: 'main', pack: ['8 oz cups, 1000', '1', '1000', 'each', '64.00'] },
      { name: '12 oz cup', category: 'packaging', base: 'each', supplier: 'main', pack: ['12 oz cups, 1000', '1', '1000', 'each', '79.00'] },
      { name: '16 oz cup', category: 'packaging', base: 'each', supplier: 'main', pack: ['16 oz cups, 1000', '1', '1000', 'each', '89.00'] },
      { name: 'Lid', category: 'packaging', base: 'each', supplier: 'main', pack: ['Lids, 1000', '1', '1000', 'each', '42.00'] },
    ],
    preparations: [],
    drinks: (() => {
      const cup = (i: number): Line[] => [[pick(i, ['8 oz cup', '12 oz cup', '16 oz cup']), '1', 'each'], ['Lid', '1', 'each']];
      const us = (name: string, prices: [string, string, string], build: (i: number) => Line[]): DrinkSeed => ({
        name,
        category: 'Espresso',
        temperature: 'hot',
        sizes: Object.fromEntries(['8 oz', '12 oz', '16 oz'].map((s, i) => [s, { price: prices[i], lines: [...build(i), ...cup(i)] }])),
      });
      return [
        us('Americano', ['2.75', '3.25', '3.75'], (i) => [['Espresso beans', pick(i, ['2', '2', '3']), 'shot'], ['Hot water', pick(i, ['5', '8', '11']), 'fl_oz_us']]),
        us('Latte', ['3.75', '4.25', '4.75'], (i) => [['Espresso beans', pick(i, ['2', '2', '3']), 'shot'], ['Whole milk', pick(i, ['6', '9', '12']), 'fl_oz_us']]),
        us('Vanilla latte', ['4.25', '4.75', '5.25'], (i) => [['Espresso beans', pick(i, ['2', '2', '3']), 'shot'], ['Whole milk', pick(i, ['6', '9', '12']), 'fl_oz_us'], ['Vanilla syrup', pick(i, ['2', '3', '4']), 'pump']]),
        us('Oat latte', ['3.75', '4.25', '4.75'], (i) => [['Espresso beans', pick(i, ['2', '2', '3']), 'shot'], ['Oat drink', pick(i, ['6', '9', '12']), 'fl_oz_us']]),
      ];
    })(),
    modifiers: [{ name: 'Extra shot', kind: 'add', upcharge: '0.75', lines: Object.fromEntries(['8 oz', '12 oz', '16 oz'].map((s) => [s, { add: [['Espresso beans', '1', 'shot']] as Line[] }])) }],
    // Massachusetts meals tax 6.25 % (MA, primary) as the invented café's rate.
    policy: { target: '75', mode: 'exclusive', tax: '6.25', step: '0.25', rounding: 'up' },
  });
}

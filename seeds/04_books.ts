import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { addMonths, monthBounds, nextDay } from '../src/shared/books';
import { D, dec, type Dec } from '../src/shared/decimal';
import { closeMonth } from '../server/books/close.service';
import { systemClock } from '../server/platform/clock';
import { countValueByCategory, purchasesByCategory } from '../server/books/cogs.repo';
import { monthSales } from '../server/books/cogs.service';
import { stockLevels } from '../server/stock/stock.service';
import { DEMO } from './01_tenancy';

// The books of the invented café for the three months before the current one, at both
// sites: storage areas, month-end counts (the one before the first month is its opening
// stock), daily till sales as one accepted import per site and month, deliveries received
// against closed orders (numbered BK-…, apart from the orders seed's PO-…), some waste; the
// oldest month closed. Figures are invented for the demo, from a fixed pseudo-random
// sequence so every reset gives the same books. Purchases are worked out from the month's
// theoretical cost so that the actual cost runs a few per cent above it, as it does in a café.

const BIZ = DEMO.businessId;
const SITES = [
  { id: DEMO.siteIds.market, code: 'MKT', scale: 1 },
  { id: DEMO.siteIds.canal, code: 'CNL', scale: 0.7 },
];
const AREAS: { name: string; categories: string[] }[] = [
  { name: 'Fridge', categories: ['dairy', 'plant-milk'] },
  { name: 'Bar', categories: ['coffee', 'syrup-sauce', 'powder', 'tea'] },
  { name: 'Dry store', categories: ['extras', 'packaging', 'other'] },
];
/** Actual over theoretical by category: a little loss everywhere, more on milk. Invented. */
const OVER: Record<string, string> = { dairy: '1.07', 'plant-milk': '1.05', coffee: '1.04' };

/** mulberry32: a small fixed pseudo-random sequence (public-domain algorithm). */
function random(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const today = () => new Date().toISOString().slice(0, 10);
const evening = (date: string) => new Date(`${date}T20:00:00Z`);

interface PackRow { id: string; supplier_id: string | null; category: string; ingredient_id: string }

async function clear(knex: Knex) {
  await knex('periods').where({ business_id: BIZ }).delete();
  await knex('sales_lines').where({ business_id: BIZ }).delete();
  await knex('sales_imports').where({ business_id: BIZ }).delete();
  await knex('waste_entries').where({ business_id: BIZ }).delete();
  await knex('stock_counts').where({ business_id: BIZ }).delete();
  await knex('storage_areas').where({ business_id: BIZ }).delete();
  await knex('recipe_costs').where({ business_id: BIZ }).delete();
  await knex('recipe_cost_months').where({ business_id: BIZ }).delete();
  await knex('till_item_mappings').where({ business_id: BIZ }).delete();
  await knex('purchase_orders').where({ business_id: BIZ }).where('number', 'like', 'BK-%').delete();
  await knex('pack_prices').where({ business_id: BIZ, note: EARLIER_PRICE }).delete();
}

const EARLIER_PRICE = 'Earlier price (books demo)';

async function insertMany(knex: Knex, table: string, rows: object[]) {
  for (let i = 0; i < rows.length; i += 2000) await knex(table).insert(rows.slice(i, i + 2000));
}

export async function seed(knex: Knex) {
  await clear(knex);
  const rand = random(20261201);
  const current = today().slice(0, 7);
  const months = [addMonths(current, -3), addMonths(current, -2), addMonths(current, -1)];
  const users = Object.fromEntries((await knex('users').where({ business_id: BIZ }).select('role', 'id')).map((u) => [u.role, u.id as string]));

  const packs: PackRow[] = await knex('packs as p').join('ingredients as i', 'i.id', 'p.ingredient_id')
    .where('p.business_id', BIZ).whereNull('p.archived_at').orderBy('p.id').select('p.id', 'p.supplier_id', 'i.category', 'i.id as ingredient_id');
  // The menu's packs are priced from a month or so ago; the books go back further, so a pack
  // without a price by the first count gets one a little below its first (invented).
  const firstCount = monthBounds(months[0]).previousLast;
  const earliest = await knex('pack_prices').where({ business_id: BIZ }).groupBy('pack_id')
    .select('pack_id', knex.raw('min(effective_from) as first'), knex.raw(`(array_agg(price order by effective_from, created_at))[1] as price`));
  const missing = earliest.filter((e) => e.first > firstCount);
  if (missing.length) {
    await knex('pack_prices').insert(missing.map((e) => ({ business_id: BIZ, pack_id: e.pack_id, price: dec(e.price).times('0.97').toDecimalPlaces(2).toFixed(), effective_from: firstCount, source: 'seed', note: EARLIER_PRICE })));
  }
  const prices = await knex('pack_prices').where({ business_id: BIZ }).orderBy([{ column: 'effective_from' }, { column: 'created_at' }]).select('pack_id', 'price', 'effective_from');
  const priceOn = (packId: string, date: string): Dec | null => {
    let p: string | null = null;
    for (const r of prices) if (r.pack_id === packId && r.effective_from <= date) p = r.price;
    return p === null ? null : dec(p);
  };
  const sizes = await knex('drink_sizes as ds').join('drinks as d', 'd.id', 'ds.drink_id').where('ds.business_id', BIZ).whereNull('d.archived_at').whereNotNull('ds.price')
    .orderBy('ds.id').select('ds.id', 'ds.price', 'd.name as drink');
  const weights = new Map(sizes.map((s) => [s.id as string, 0.5 + rand() * 6]));

  for (const site of SITES) {
    // The stock on hand the orders seed left (last week's deliveries): the count at the end of
    // last month shows exactly that, so today's stock levels and suggested orders stay the same.
    const onHand = new Map((await stockLevels(knex, BIZ, site.id)).levels.map((l) => [l.item.pack_id, l.onHand]));

    const areaIds = new Map<string, string>();
    for (const [i, a] of AREAS.entries()) {
      const [row] = await knex('storage_areas').insert({ business_id: BIZ, site_id: site.id, name: a.name, position: i }).returning('id');
      for (const c of a.categories) areaIds.set(c, row.id);
    }
    for (const p of packs) {
      await knex('stock_items').where({ site_id: site.id, pack_id: p.id }).update({ storage_area_id: areaIds.get(p.category) ?? null });
    }

    // Daily till sales (more at the weekend) as one accepted import per month, and some waste.
    for (const month of months) await seedSalesAndWaste(knex, site, month, sizes, weights, packs, users, rand);

    // What each category costs a month by the recipes: counts hold a week or so of it.
    const theoretical: Map<string, Dec>[] = [];
    for (const month of months) {
      const agg = await monthSales(knex, BIZ, site.id, month);
      theoretical.push(new Map(agg.theoretical.map((t) => [t.category, dec(t.cost)])));
    }

    // Month-end counts: before the first month, then at the end of each.
    const countDays = [monthBounds(months[0]).previousLast, ...months.map((m) => monthBounds(m).last)];
    for (const [n, day] of countDays.entries()) {
      const usage = theoretical[Math.min(n, months.length - 1)];
      const last = n === countDays.length - 1;
      const [c] = await knex('stock_counts').insert({
        business_id: BIZ, site_id: site.id, count_date: day, status: 'finished', started_by: users.barista, finished_by: users.manager,
        finished_at: evening(day), created_at: evening(day), updated_at: evening(day),
      }).returning('id');
      const lines = packs.map((p) => {
        let counted: Dec;
        if (last) counted = D.max(onHand.get(p.id) ?? new D(0), 0).toDecimalPlaces(4);
        else {
          const peers = packs.filter((x) => x.category === p.category).length;
          const price = priceOn(p.id, day);
          const value = (usage.get(p.category) ?? new D(0)).times(0.15 + rand() * 0.15).div(peers);
          counted = price && price.gt(0) ? value.div(price).times(4).toDecimalPlaces(0).div(4) : new D(0);
        }
        return { business_id: BIZ, count_id: c.id, pack_id: p.id, storage_area_id: areaIds.get(p.category) ?? null, packs: counted.toFixed(), counted_by: users.barista, counted_at: evening(day) };
      });
      await insertMany(knex, 'stock_count_lines', lines);
    }

    // Deliveries: enough that actual = theoretical × OVER once the counts (and the orders seed's
    // deliveries) are taken into account; whole packs, the cheapest pack of a category taking up the rounding.
    for (const [m, month] of months.entries()) {
      const { first, last, previousLast } = monthBounds(month);
      const value = async (day: string) => {
        const count = await knex('stock_counts').where({ site_id: site.id, count_date: day }).first('id');
        return new Map((await countValueByCategory(knex, [count.id])).map((v) => [v.category, dec(v.value)]));
      };
      const [openV, closeV] = [await value(previousLast), await value(last)];
      const already = new Map((await purchasesByCategory(knex, BIZ, site.id, first, last)).map((v) => [v.category, dec(v.net)]));
      const byPack = new Map<string, number>();
      for (const [category, cost] of theoretical[m]) {
        let remaining = cost.times(OVER[category] ?? '1.02').plus(closeV.get(category) ?? 0).minus(openV.get(category) ?? 0).minus(already.get(category) ?? 0);
        const supplied = packs.filter((p) => p.category === category && p.supplier_id && priceOn(p.id, first)?.gt(0))
          .sort((a, b) => (priceOn(b.id, first) as Dec).comparedTo(priceOn(a.id, first) as Dec));
        for (const [i, p] of supplied.entries()) {
          if (remaining.lte(0)) break;
          const price = priceOn(p.id, first) as Dec;
          const q = remaining.div(supplied.length - i).div(price).toDecimalPlaces(0).toNumber();
          if (q > 0) byPack.set(p.id, q);
          remaining = remaining.minus(price.times(q));
        }
      }
      await seedDeliveries(knex, site, month, packs, byPack, priceOn, users);
    }
  }
  await knex.raw(`update purchase_order_lines l set description = i.name || ': ' || p.description from packs p join ingredients i on i.id = p.ingredient_id
    where p.id = l.pack_id and l.order_id in (select id from purchase_orders where business_id = ? and number like 'BK-%')`, [BIZ]);

  // The oldest month is closed by the bookkeeper; the other two are open.
  await closeMonth({ db: knex, clock: systemClock }, BIZ, users.bookkeeper, months[0], 'Month end');
}

type Users = Record<string, string>;
type Site = (typeof SITES)[number];

async function seedSalesAndWaste(knex: Knex, site: Site, month: string, sizes: { id: string; price: string }[], weights: Map<string, number>, packs: PackRow[], users: Users, rand: () => number) {
  const { first, last } = monthBounds(month);
  const sales: { sold_on: string; drink_size_id: string; quantity: string; net_sales: string; tax: string }[] = [];
  for (let day = first; day <= last; day = nextDay(day)) {
    const weekday = new Date(`${day}T00:00:00Z`).getUTCDay();
    const busy = (weekday === 0 || weekday === 6 ? 1.3 : 1) * site.scale;
    for (const s of sizes) {
      const q = Math.floor((weights.get(s.id) as number) * busy * (0.6 + rand() * 0.8));
      if (q <= 0) continue;
      // Menu prices include VAT at 20 %: net = gross ÷ 1.2 (HMRC VAT fraction), to the penny.
      const gross = dec(s.price).times(q);
      const net = gross.div('1.2').toDecimalPlaces(2);
      sales.push({ sold_on: day, drink_size_id: s.id, quantity: String(q), net_sales: net.toFixed(), tax: gross.minus(net).toFixed(2) });
    }
  }
  const name = `till-${month}-${site.code.toLowerCase()}.csv`;
  const [imp] = await knex('sales_imports').insert({
    business_id: BIZ, site_id: site.id, file_sha256: createHash('sha256').update(`${name}:${sales.length}`).digest('hex'), filename: name,
    row_count: sales.length, status: 'accepted', first_day: first, last_day: last, created_by: users.bookkeeper,
    created_at: evening(nextDay(last)), accepted_at: evening(nextDay(last)),
  }).returning('id');
  await insertMany(knex, 'sales_lines', sales.map((s) => ({ business_id: BIZ, site_id: site.id, import_id: imp.id, ...s })));

  const milk = packs.find((p) => p.category === 'dairy');
  const oat = packs.find((p) => p.category === 'plant-milk');
  const waste = [
    milk && { occurred_on: nextDay(first, 4), ingredient_id: milk.ingredient_id, quantity: String(400 + Math.floor(rand() * 6) * 100), unit: 'ml', reason: 'Milk steamed and not used' },
    { occurred_on: nextDay(first, 11), drink_size_id: sizes[Math.floor(rand() * sizes.length)].id, quantity: String(1 + Math.floor(rand() * 3)), reason: 'Remade: wrong milk' },
    oat && { occurred_on: nextDay(first, 19), ingredient_id: oat.ingredient_id, quantity: '1', unit: 'l', reason: 'Past its use-by date' },
    milk && { occurred_on: nextDay(first, 23), ingredient_id: milk.ingredient_id, quantity: '2', unit: 'l', reason: 'Fridge left open overnight' },
  ].filter(Boolean) as { occurred_on: string }[];
  await knex('waste_entries').insert(waste.map((w) => ({ business_id: BIZ, site_id: site.id, recorded_by: users.barista, ...w, created_at: evening(w.occurred_on) })));
}

/** Closed orders with their receipts: each supplier delivers twice a month (the 5th and the 19th). */
async function seedDeliveries(knex: Knex, site: Site, month: string, packs: PackRow[], byPack: Map<string, number>, priceOn: (packId: string, date: string) => Dec | null, users: Users) {
  const { first } = monthBounds(month);
  const suppliers = [...new Set(packs.filter((p) => byPack.has(p.id)).map((p) => p.supplier_id as string))].sort();
  let n = 0;
  for (const supplierId of suppliers) {
    for (const [k, dayOffset] of [4, 18].entries()) {
      const receivedOn = nextDay(first, dayOffset);
      const lines = packs.filter((p) => p.supplier_id === supplierId && byPack.has(p.id)).map((p) => {
        const total = byPack.get(p.id) as number;
        return { pack: p, quantity: k === 0 ? Math.ceil(total / 2) : Math.floor(total / 2), unitPrice: priceOn(p.id, receivedOn) as Dec };
      }).filter((l) => l.quantity > 0);
      if (!lines.length) continue;
      const subtotal = lines.reduce((s, l) => s.plus(l.unitPrice.times(l.quantity)), new D(0));
      const number = `BK-${month}-${site.code}-${String((n += 1)).padStart(2, '0')}`;
      const at = evening(receivedOn);
      const [po] = await knex('purchase_orders').insert({
        business_id: BIZ, site_id: site.id, supplier_id: supplierId, number, status: 'closed', currency: 'GBP', subtotal: subtotal.toFixed(4), tax: '0', total: subtotal.toFixed(4),
        payment_terms: 'account', supplier_invoice_number: `INV-${number.slice(3)}`, payment_reference: `BACS ${month.replace('-', '')}${String(n).padStart(3, '0')}`,
        placed_at: at, received_at: at, closed_at: at, created_by: users.manager, created_at: at, updated_at: at,
      }).returning('id');
      const orderLines = await knex('purchase_order_lines').insert(lines.map((l, i) => ({
        business_id: BIZ, order_id: po.id, pack_id: l.pack.id, position: i, description: `Pack ${i + 1}`, quantity: String(l.quantity), unit_price: l.unitPrice.toFixed(4),
        line_total: l.unitPrice.times(l.quantity).toFixed(4), quantity_received: String(l.quantity),
      }))).returning(['id', 'pack_id']);
      const [r] = await knex('receipts').insert({ business_id: BIZ, site_id: site.id, order_id: po.id, received_on: receivedOn, supplier_invoice_number: `INV-${number.slice(3)}`, received_by: users.manager, created_at: at }).returning('id');
      await knex('receipt_lines').insert(lines.map((l) => ({
        business_id: BIZ, receipt_id: r.id, order_line_id: orderLines.find((o) => o.pack_id === l.pack.id)?.id ?? null, pack_id: l.pack.id,
        quantity: String(l.quantity), unit_price: l.unitPrice.toFixed(4), net: l.unitPrice.times(l.quantity).toFixed(2), tax: '0',
      })));
    }
  }
}

import type { Knex } from 'knex';
import { D, dec, type Dec } from '../../src/shared/decimal';
import { roundHalfUp, writeMoney, writeQuantity } from '../../src/shared/money';
import { minimumShortfall, nextDeliveryDate, orderTotals, suggestedPacks } from '../../src/shared/ordering';
import { UnitConversionError } from '../../src/shared/units';
import { addUsage, usageOfCounts, UsageExploder, type Usage } from '../../src/shared/usage';
import { loadCostModel } from '../costing/cost-model.service';
import { groupBy } from '../../src/shared/collections';
import { invalidInput, notFound } from '../platform/errors';
import { businessOf, packsForOrder, siteOfBusiness, supplierTerms } from '../orders/orders.repo';
import { localNow } from '../orders/orders.service';
import { buildsOf, countedPacks, lastCount, receivedSince, salesByDrinkSizeSince, stockItems, upsertStockItem, wasteSince, type StockItemRow } from './stock.repo';
import { baseUnitsPerPack, usageItems, usageLine } from './usage.service';

/** Figures of stock on hand are shown to 4 decimal places (a count records fractions of an open pack). */
const ON_HAND_PLACES = 4;

/** What moved a pack's stock since the last count, in packs (waste and sales as amounts taken off). */
export interface StockMovements {
  counted: Dec;
  received: Dec;
  waste: Dec;
  sales: Dec;
}

export interface StockLevel {
  item: StockItemRow;
  /** counted + received − waste − sales. */
  onHand: Dec;
  movements: StockMovements;
}

/**
 * Stock on hand per pack at a site, in packs:
 *   last finished count + packs received since − waste since − theoretical usage of sales since.
 * - "Since" for deliveries and waste is the moment the count was finished; for till sales,
 *   which carry only a day, the days after the count's date (a count is the stock at the close
 *   of its day, as the books read month-end counts). No count: everything ever recorded.
 * - Waste of an ingredient is taken off as recorded (it is what left stock). Waste of a
 *   preparation, and cups of a drink wasted, are exploded through the recipe like sales.
 * - Sales: cups per drink size (manual days and accepted imports only) × the build's lines,
 *   through preparations (each line per unit of the preparation's batch yield, nested), an
 *   ingredient's line quantity being what goes in the cup, so usage from stock = quantity ÷
 *   (yield ÷ 100). See src/shared/usage.ts.
 * - An ingredient's usage comes out of the pack the cost model costs it by (the owner's costing
 *   pack, else the most recently priced) when that pack is stocked at the site, else out of
 *   the first stocked pack of the ingredient in the stock list's order (supplier, pack). In
 *   packs: usage in base units ÷ (pack count × pack quantity in base units). An ingredient with
 *   no stocked pack at the site is not tracked there and is left out.
 * Lines that cannot be read (a unit that does not convert, a drink size without a build) are
 * left out and reported in `notes`, never guessed.
 */
export async function stockLevels(db: Knex, businessId: string, siteId: string): Promise<{ levels: StockLevel[]; countedOn: string | null; notes: string[] }> {
  const [items, count] = await Promise.all([stockItems(db, businessId, siteId), lastCount(db, businessId, siteId)]);
  const since: Date | null = count?.finished_at ?? null;
  const afterDay: string | null = count?.count_date ?? null;
  const [counted, received, waste, sales, loaded] = await Promise.all([
    count ? countedPacks(db, count.id) : Promise.resolve([]),
    receivedSince(db, businessId, siteId, since),
    wasteSince(db, businessId, siteId, since),
    salesByDrinkSizeSince(db, businessId, siteId, afterDay),
    loadCostModel(db, businessId),
  ]);
  const sizeIds = [...new Set([...sales.map((s) => s.drink_size_id), ...waste.map((w) => w.drink_size_id).filter((x): x is string => x !== null)])];
  const builds = await buildsOf(db, businessId, sizeIds);
  const recipes = new Map([...groupBy(builds.lines, (l) => l.drink_size_id)].map(([id, lines]) => [id, lines.map(usageLine)]));

  const usageItemsByKey = new Map(usageItems(loaded).map((i) => [i.key, i]));
  const exploder = new UsageExploder(usageItemsByKey.values());
  const notes: string[] = [];

  // Waste, in base units of each ingredient.
  const wasted: Usage = new Map();
  const wastedCups: { recipe: string; count: Dec; label?: string }[] = [];
  for (const w of waste) {
    if (w.drink_size_id) {
      wastedCups.push({ recipe: w.drink_size_id, count: dec(w.quantity), label: builds.labels.get(w.drink_size_id) });
      continue;
    }
    const item = usageItemsByKey.get((w.ingredient_id ?? w.preparation_id) as string);
    if (!item) continue; // archived since: its packs are no longer stocked
    const unit = w.unit ?? item.baseUnit;
    if (item.kind === 'ingredient') {
      try {
        addUsage(wasted, new Map([[item.key, exploder.inBaseUnit(item, dec(w.quantity), unit)]]));
      } catch (err) {
        if (!(err instanceof UnitConversionError)) throw err;
        notes.push(`Waste of ${item.name}: ${err.message}`);
      }
    } else {
      const r = exploder.explode([{ item: item.key, quantity: dec(w.quantity), unit }]);
      addUsage(wasted, r.usage);
      notes.push(...r.problems);
    }
  }
  const cupsWasted = usageOfCounts(exploder, recipes, wastedCups);
  addUsage(wasted, cupsWasted.usage);
  const sold = usageOfCounts(exploder, recipes, sales.map((s) => ({ recipe: s.drink_size_id, count: dec(s.quantity), label: builds.labels.get(s.drink_size_id) })));
  notes.push(...cupsWasted.problems, ...sold.problems);

  const movements = new Map<string, StockMovements>(items.map((i) => [i.pack_id, { counted: new D(0), received: new D(0), waste: new D(0), sales: new D(0) }]));
  const move = (packId: string, kind: keyof StockMovements, v: Dec) => {
    const m = movements.get(packId);
    if (m) m[kind] = m[kind].plus(v);
  };
  for (const l of counted) move(l.pack_id, 'counted', dec(l.packs));
  for (const r of received) move(r.pack_id, 'received', dec(r.quantity));

  const stocked = groupBy(items, (i) => i.ingredient_id);
  const packFor = (ingredientId: string): StockItemRow | undefined => {
    const list = stocked.get(ingredientId);
    if (!list) return undefined;
    const costingId = loaded.ingredients.get(ingredientId)?.costingPack?.id ?? list[0].costing_pack_id;
    return list.find((i) => i.pack_id === costingId) ?? list[0];
  };
  const takeOff = (usage: Usage, kind: 'waste' | 'sales') => {
    for (const [ingredientId, base] of usage) {
      const pack = packFor(ingredientId);
      const item = usageItemsByKey.get(ingredientId);
      if (!pack || !item) continue;
      const perPack = baseUnitsPerPack(pack, item);
      if (perPack) move(pack.pack_id, kind, base.div(perPack));
      else notes.push(`${item.name}: the pack "${pack.description}" is not in ${item.baseUnit} terms, so its usage is not taken off.`);
    }
  };
  takeOff(wasted, 'waste');
  takeOff(sold.usage, 'sales');

  const levels = items.map((item) => {
    const m = movements.get(item.pack_id) as StockMovements;
    return { item, movements: m, onHand: m.counted.plus(m.received).minus(m.waste).minus(m.sales) };
  });
  // Sorted so the page (and a test) sees the same order every time.
  return { levels, countedOn: count?.count_date ?? null, notes: [...new Set(notes)].sort() };
}

function presentLevel(l: StockLevel) {
  const onHand = roundHalfUp(l.onHand, ON_HAND_PLACES);
  return {
    packId: l.item.pack_id,
    description: `${l.item.ingredient_name}: ${l.item.description}`,
    supplier: l.item.supplier_id ? { id: l.item.supplier_id, name: l.item.supplier_name } : null,
    storageArea: l.item.storage_area_id ? { id: l.item.storage_area_id, name: l.item.storage_area_name } : null,
    onHand: writeQuantity(onHand),
    par: writeQuantity(l.item.par_level),
    reorderPoint: writeQuantity(l.item.reorder_point),
    atOrBelowReorder: l.onHand.lte(dec(l.item.reorder_point)),
    suggested: writeQuantity(suggestedPacks({ onHand: l.onHand, par: l.item.par_level, reorderPoint: l.item.reorder_point })),
    movements: {
      counted: writeQuantity(roundHalfUp(l.movements.counted, ON_HAND_PLACES)),
      received: writeQuantity(roundHalfUp(l.movements.received, ON_HAND_PLACES)),
      waste: writeQuantity(roundHalfUp(l.movements.waste, ON_HAND_PLACES)),
      sales: writeQuantity(roundHalfUp(l.movements.sales, ON_HAND_PLACES)),
    },
  };
}

export async function presentStock(db: Knex, businessId: string, siteId: string) {
  const site = await siteOfBusiness(db, businessId, siteId);
  if (!site) throw notFound('That site');
  const { levels, countedOn, notes } = await stockLevels(db, businessId, siteId);
  return { site: { id: site.id, name: site.name }, countedOn, items: levels.map(presentLevel), notes };
}

export async function setLevel(db: Knex, businessId: string, siteId: string, packId: string, v: { par: string; reorderPoint: string }) {
  const site = await siteOfBusiness(db, businessId, siteId);
  if (!site) throw notFound('That site');
  const pack = await db('packs').where({ business_id: businessId, id: packId }).first('id');
  if (!pack) throw notFound('That pack');
  await upsertStockItem(db, { business_id: businessId, site_id: siteId, pack_id: packId, par_level: v.par, reorder_point: v.reorderPoint });
  const { levels } = await stockLevels(db, businessId, siteId);
  return presentLevel(levels.find((l) => l.item.pack_id === packId) as StockLevel);
}

/** The suggested order for one supplier at one site: packs at or below their reorder point, topped up to par. */
export async function suggestedOrder(db: Knex, businessId: string, siteId: string, supplierId: string) {
  const site = await siteOfBusiness(db, businessId, siteId);
  if (!site) throw notFound('That site');
  const supplier = await supplierTerms(db, businessId, supplierId);
  if (!supplier) throw invalidInput({ supplierId: 'That supplier was not found.' });
  const business = await businessOf(db, businessId);
  const { levels } = await stockLevels(db, businessId, siteId);
  const mine = levels.filter((l) => l.item.supplier_id === supplierId);
  const wanted = mine.map((l) => ({ l, quantity: suggestedPacks({ onHand: l.onHand, par: l.item.par_level, reorderPoint: l.item.reorder_point }) })).filter((x) => x.quantity.gt(0));
  const prices = new Map((await packsForOrder(db, businessId, wanted.map((w) => w.l.item.pack_id), localNow().date)).map((p) => [p.id, p]));
  const priced = wanted.map((w) => {
    const p = prices.get(w.l.item.pack_id);
    return { ...w, unitPrice: p?.price ?? '0', taxPct: p?.purchase_tax_pct ?? '0' };
  });
  const totals = orderTotals(priced.map((p) => ({ quantity: p.quantity.toFixed(), unitPrice: p.unitPrice, taxPct: p.taxPct })), supplier.delivery_charge, business.currency);
  const now = localNow();
  return {
    site: { id: site.id, name: site.name },
    supplier: { id: supplier.id, name: supplier.name, paymentTerms: supplier.payment_terms, minimumOrder: writeMoney(supplier.minimum_order, business.currency) },
    currency: business.currency,
    lines: priced.map((p, i) => ({
      packId: p.l.item.pack_id,
      description: `${p.l.item.ingredient_name}: ${p.l.item.description}`,
      onHand: writeQuantity(roundHalfUp(p.l.onHand, ON_HAND_PLACES)),
      par: writeQuantity(p.l.item.par_level),
      reorderPoint: writeQuantity(p.l.item.reorder_point),
      quantity: writeQuantity(p.quantity),
      unitPrice: p.unitPrice === null ? null : writeMoney(p.unitPrice, business.currency),
      lineTotal: totals.lines[i].lineTotal,
    })),
    subtotal: totals.subtotal,
    tax: totals.tax,
    deliveryCharge: totals.deliveryCharge,
    total: totals.total,
    minimumShortfall: priced.length ? minimumShortfall(totals.subtotal, supplier.minimum_order, business.currency) : null,
    nextDelivery: nextDeliveryDate({ date: now.date, time: now.time, deliveryDays: supplier.delivery_days, cutoff: supplier.order_cutoff, leadDays: supplier.lead_days }),
  };
}

import type { Knex } from 'knex';
import { D, dec, type Dec } from '../../src/shared/decimal';
import { roundHalfUp, writeMoney, writeQuantity } from '../../src/shared/money';
import { minimumShortfall, nextDeliveryDate, orderTotals, suggestedPacks } from '../../src/shared/ordering';
import { toBaseUnit, UnitConversionError } from '../../src/shared/units';
import { invalidInput, notFound } from '../errors';
import { businessOf, packsForOrder, siteOfBusiness, supplierTerms } from '../orders/orders.repo';
import { localNow } from '../orders/orders.service';
import { countedPacks, ingredientWasteSince, lastCount, receivedSince, stockItems, upsertStockItem, type StockItemRow } from './stock.repo';

/** Figures of stock on hand are shown to 4 decimal places (a count records fractions of an open pack). */
const ON_HAND_PLACES = 4;

export interface StockLevel {
  item: StockItemRow;
  onHand: Dec;
}

/**
 * Stock on hand per pack at a site, in packs: the last finished count, plus the packs
 * received since it, minus the ingredient waste recorded since it (converted to packs of
 * the ingredient's stocked pack). Till sales' theoretical usage is not taken off yet.
 */
export async function stockLevels(db: Knex, businessId: string, siteId: string): Promise<{ levels: StockLevel[]; countedOn: string | null }> {
  const items = await stockItems(db, businessId, siteId);
  const count = await lastCount(db, businessId, siteId);
  const since: Date | null = count?.finished_at ?? null;
  const onHand = new Map<string, Dec>(items.map((i) => [i.pack_id, new D(0)]));
  const add = (packId: string, v: Dec) => onHand.set(packId, (onHand.get(packId) ?? new D(0)).plus(v));
  if (count) for (const l of await countedPacks(db, count.id)) add(l.pack_id, dec(l.packs));
  for (const r of await receivedSince(db, businessId, siteId, since)) add(r.pack_id, dec(r.quantity));

  const byIngredient = new Map<string, StockItemRow>();
  for (const i of items) {
    const chosen = byIngredient.get(i.ingredient_id);
    if (!chosen || (i.costing_pack_id === i.pack_id && chosen.costing_pack_id !== chosen.pack_id)) byIngredient.set(i.ingredient_id, i);
  }
  for (const w of await ingredientWasteSince(db, businessId, siteId, since)) {
    const item = byIngredient.get(w.ingredient_id);
    if (!item) continue;
    try {
      const density = item.density_g_per_ml ? dec(item.density_g_per_ml) : null;
      const perPack = dec(item.pack_count).times(toBaseUnit(dec(item.pack_quantity), item.pack_unit, item.base_unit, density));
      const wasted = toBaseUnit(dec(w.quantity), w.unit ?? item.base_unit, item.base_unit, density);
      if (perPack.gt(0)) add(item.pack_id, wasted.div(perPack).negated());
    } catch (err) {
      // Waste in a unit that cannot be put in this pack's terms is left out, not guessed.
      if (!(err instanceof UnitConversionError)) throw err;
    }
  }
  return { levels: items.map((item) => ({ item, onHand: onHand.get(item.pack_id) as Dec })), countedOn: count?.count_date ?? null };
}

function presentLevel(l: StockLevel) {
  const onHand = roundHalfUp(l.onHand, ON_HAND_PLACES);
  return {
    packId: l.item.pack_id,
    description: `${l.item.ingredient_name}: ${l.item.description}`,
    supplier: l.item.supplier_id ? { id: l.item.supplier_id, name: l.item.supplier_name } : null,
    onHand: writeQuantity(onHand),
    par: writeQuantity(l.item.par_level),
    reorderPoint: writeQuantity(l.item.reorder_point),
    atOrBelowReorder: l.onHand.lte(dec(l.item.reorder_point)),
    suggested: writeQuantity(suggestedPacks({ onHand: l.onHand, par: l.item.par_level, reorderPoint: l.item.reorder_point })),
  };
}

export async function presentStock(db: Knex, businessId: string, siteId: string) {
  const site = await siteOfBusiness(db, businessId, siteId);
  if (!site) throw notFound('That site');
  const { levels, countedOn } = await stockLevels(db, businessId, siteId);
  return { site: { id: site.id, name: site.name }, countedOn, items: levels.map(presentLevel) };
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

import type { Knex } from 'knex';
import { stringify } from 'csv-stringify/sync';
import { ALLERGEN_CAUTION, ALLERGENS } from '../../src/shared/allergens';
import { dec } from '../../src/shared/decimal';
import { writeMoney } from '../../src/shared/money';
import { loadMenuRows } from '../costing/cost-model.repo';
import { loadCostModel } from '../costing/cost-model.service';
import { utcToday as today } from '../platform/clock';
import { groupBy } from '../../src/shared/collections';
import { money } from '../platform/present';
import { notFound } from '../platform/errors';
import { businessName, listModifierLines, menuPricesEffectiveFrom, plannedPackPrices, priceHistory, type PriceHistoryRow } from './repricing.repo';
import { nextPlannedDate } from './schedule.repo';

/** Printed with tax-inclusive prices; tax rules differ by place and by eat-in or takeaway. */
const TAX_NOTE = {
  inclusive: 'Prices include VAT/sales tax at the rate set in the pricing policy.',
  exclusive: 'Prices exclude sales tax, which is added at the till.',
} as const;

/**
 * The price list for the counter on `date` (default today), from the menu: every live drink with
 * its sizes and the prices in force that day (planned ones included), the allergens of its build
 * (through preparations), add-ons with their upcharge and allergens, the date those prices took
 * effect, the next planned change after it, and the allergen caution.
 */
export async function priceList(db: Knex, businessId: string, date: string = today()) {
  const [business, menu, loaded, effectiveFrom, nextChangeFrom, modifierLines] = await Promise.all([
    businessName(db, businessId),
    loadMenuRows(db, businessId, undefined, date),
    loadCostModel(db, businessId),
    menuPricesEffectiveFrom(db, businessId, date),
    nextPlannedDate(db, businessId, date),
    listModifierLines(db, businessId),
  ]);
  const { currency } = loaded;
  const sizesByDrink = groupBy(menu.sizes, (s) => s.drink_id);
  const linesByDrink = groupBy(menu.lines, (l) => menu.sizes.find((s) => s.id === l.drink_size_id)?.drink_id ?? '');
  const cupSizes = new Map<string, { sizeId: string; name: string; volumeMl: string; position: number }>();
  for (const s of menu.sizes) cupSizes.set(s.size_id, { sizeId: s.size_id, name: s.size_name, volumeMl: dec(s.volume_ml).toFixed(), position: s.position });
  const drinks = menu.drinks.map((d) => ({
    id: d.id,
    name: d.name,
    category: d.category,
    temperature: d.temperature,
    sizes: (sizesByDrink.get(d.id) ?? []).map((s) => ({ sizeId: s.size_id, name: s.size_name, price: money(s.price, currency) })),
    allergens: loaded.allergensOf((linesByDrink.get(d.id) ?? []).map((l) => (l.ingredient_id ?? l.preparation_id) as string)),
  }));
  const modifiers = [...groupBy(modifierLines, (l) => l.modifier_id).values()].map((ls) => ({
    id: ls[0].modifier_id,
    name: ls[0].modifier_name,
    upcharge: money(ls[0].upcharge, currency),
    allergens: loaded.allergensOf(ls.filter((l) => l.action === 'add').map((l) => (l.ingredient_id ?? l.preparation_id) as string)),
  }));
  return {
    business: { name: business!.name, currency, taxMode: business!.tax_mode },
    date,
    effectiveFrom: effectiveFrom ?? null,
    nextChangeFrom,
    generatedOn: today(),
    taxNote: TAX_NOTE[business!.tax_mode],
    sizes: [...cupSizes.values()].sort((a, b) => a.position - b.position || dec(a.volumeMl).comparedTo(dec(b.volumeMl))).map(({ position: _p, ...s }) => s),
    drinks,
    modifiers,
    allergenNames: ALLERGENS,
    allergenCaution: ALLERGEN_CAUTION,
  };
}

/** The price list as CSV: one line per drink and size (RFC 4180, through csv-stringify). */
export async function priceListCsv(db: Knex, businessId: string, date?: string): Promise<string> {
  const list = await priceList(db, businessId, date);
  const records: string[][] = [];
  for (const d of list.drinks) {
    const allergens = d.allergens.map((a) => ALLERGENS[a]).join('; ');
    for (const s of d.sizes) {
      records.push([d.name, d.category, d.temperature, s.name, list.sizes.find((x) => x.sizeId === s.sizeId)?.volumeMl ?? '', s.price ?? '', list.business.currency, allergens, list.effectiveFrom ?? '']);
    }
  }
  for (const m of list.modifiers) records.push([m.name, 'Add-on', '', '', '', m.upcharge ?? '', list.business.currency, m.allergens.map((a) => ALLERGENS[a]).join('; '), list.effectiveFrom ?? '']);
  return stringify(records, {
    header: true,
    columns: ['drink', 'category', 'temperature', 'size', 'volume_ml', 'price', 'currency', 'allergens', 'effective_from'],
    record_delimiter: 'windows',
  });
}

/** The fields every menu price change is shown with (history and scheduled prices). */
export function presentPriceChange(r: Omit<PriceHistoryRow, 'status' | 'cancelled_at'>, currency: string) {
  return {
    id: r.id,
    drinkSizeId: r.drink_size_id,
    sizeId: r.size_id,
    size: r.size_name,
    oldPrice: money(r.old_price, currency),
    newPrice: writeMoney(r.new_price, currency),
    effectiveFrom: r.effective_from,
    reason: r.reason,
    scenarioId: r.scenario_id,
    scenarioName: r.scenario_name,
  };
}

export async function drinkPriceHistory(db: Knex, businessId: string, drinkId: string) {
  const drink = await db('drinks').where({ business_id: businessId, id: drinkId }).first('id', 'name', 'archived_at');
  if (!drink) throw notFound('That drink');
  const [rows, business] = await Promise.all([priceHistory(db, businessId, drinkId), businessName(db, businessId)]);
  const currency = business!.currency;
  const now = today();
  return {
    drink: { id: drink.id, name: drink.name, archived: drink.archived_at !== null },
    currency,
    history: rows.map((r) => ({
      ...presentPriceChange(r, currency),
      changedBy: r.changed_by ? { id: r.changed_by, name: r.changed_by_name } : null,
      changedAt: new Date(r.changed_at).toISOString(),
      // A planned price whose date has come is in force even before a write folds it in.
      status: r.status === 'planned' && r.effective_from <= now ? ('applied' as const) : r.status,
      planned: r.status === 'planned' && r.effective_from > now,
      cancelledAt: r.cancelled_at ? new Date(r.cancelled_at).toISOString() : null,
    })),
  };
}

/** Pack prices dated after today, with the price in force now: what suppliers have announced. */
export async function plannedChanges(db: Knex, businessId: string) {
  const now = today();
  const [rows, loaded] = await Promise.all([plannedPackPrices(db, businessId, now), loadCostModel(db, businessId)]);
  const { currency } = loaded;
  return {
    currency,
    planned: rows.map((r) => {
      const ing = loaded.ingredients.get(r.ingredient_id);
      const pack = ing?.packs.find((p) => p.id === r.pack_id);
      return {
        ingredientId: r.ingredient_id,
        ingredientName: r.ingredient_name,
        packId: r.pack_id,
        packDescription: r.description,
        isCostingPack: ing?.costingPack?.id === r.pack_id,
        currentPrice: money(pack?.price ?? null, currency),
        price: writeMoney(r.price, currency),
        effectiveFrom: r.effective_from,
        note: r.note,
      };
    }),
  };
}

import type { Knex } from 'knex';
import { D, dec, type Dec } from '../../src/shared/decimal';
import { writeCost, writeMoney, writePercent } from '../../src/shared/money';
import { exactPriceFigures, parsePolicy, roundPrice, grossForTargetMargin, type ExactPriceFigures } from '../../src/shared/pricing';
import type { PreviewInput } from '../../src/shared/schemas/repricing';
import { loadCostRows, loadMenuRows, type BuildLineRow, type DrinkSizeRow, type LineRow } from '../costing/cost-model.repo';
import { buildLoadedCostModel, type LoadedCostModel } from '../costing/cost-model.service';
import { utcToday as today } from '../platform/clock';
import { groupBy } from '../../src/shared/collections';
import { invalidInput } from '../platform/errors';
import { keepLadder } from './ladder';
import { cupsSold, expectedWeeklyCups, listModifierLines, type ModifierLineRow } from './repricing.repo';

/** Weeks of till sales used for the weekly mix. */
export const SALES_WEEKS = 4;
/** Average weeks in a month: 52 ÷ 12 (a 52-week year; common practice, no source). */
export const WEEKS_PER_MONTH = new D(52).div(12);

const HUNDRED = new D(100);

type Decision = NonNullable<PreviewInput['decisions']>[number];

function daysBefore(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() - days);
  return d.toISOString().slice(0, 10);
}

const pct = (v: Dec | null) => (v === null ? null : writePercent(v));
const cost = (v: Dec | null) => (v === null ? null : writeCost(v));

/**
 * Items whose cost moves: the changed ingredients, then every preparation that uses one of them
 * (or a preparation that does) at any depth. Returns, for each affected preparation, the
 * changed ingredient ids it reaches.
 */
function affectedPreparations(loaded: LoadedCostModel, changed: ReadonlySet<string>): Map<string, Set<string>> {
  const parents = new Map<string, Set<string>>();
  for (const prep of loaded.preparations.values()) {
    for (const l of prep.lines) {
      const child = (l.ingredient_id ?? l.preparation_id) as string;
      let set = parents.get(child);
      if (!set) parents.set(child, (set = new Set()));
      set.add(prep.row.id);
    }
  }
  const reach = new Map<string, Set<string>>();
  for (const ing of changed) {
    const queue = [ing];
    const seen = new Set<string>();
    while (queue.length) {
      const item = queue.pop() as string;
      for (const parent of parents.get(item) ?? []) {
        if (seen.has(parent)) continue;
        seen.add(parent);
        let r = reach.get(parent);
        if (!r) reach.set(parent, (r = new Set()));
        r.add(ing);
        queue.push(parent);
      }
    }
  }
  return reach;
}

interface Usage {
  direct: Set<string>;
  preparations: Set<string>;
  ingredients: Set<string>;
}

function usageOf(lines: readonly LineRow[], changed: ReadonlySet<string>, preps: ReadonlyMap<string, Set<string>>): Usage | null {
  const u: Usage = { direct: new Set(), preparations: new Set(), ingredients: new Set() };
  for (const l of lines) {
    if (l.ingredient_id && changed.has(l.ingredient_id)) {
      u.direct.add(l.ingredient_id);
      u.ingredients.add(l.ingredient_id);
    }
    const reached = l.preparation_id ? preps.get(l.preparation_id) : undefined;
    if (reached) {
      u.preparations.add(l.preparation_id as string);
      for (const i of reached) u.ingredients.add(i);
    }
  }
  return u.ingredients.size ? u : null;
}

interface WeeklyCups {
  cups: Dec | null;
  source: 'sales' | 'expected' | null;
}

/**
 * Cups a week for each drink size: imported till sales over the last 4 weeks ÷ 4 when the size
 * sold any; else the owner's expected cups a week for the drink, shared equally among its sizes
 * (our own assumption until sales are imported); else unknown.
 */
async function weeklyMix(db: Knex, businessId: string, sizes: readonly DrinkSizeRow[], asOf: string) {
  const from = daysBefore(asOf, SALES_WEEKS * 7);
  const to = daysBefore(asOf, 1);
  const [sold, expected] = await Promise.all([cupsSold(db, businessId, from, to), expectedWeeklyCups(db, businessId)]);
  const sizesPerDrink = new Map<string, number>();
  for (const s of sizes) sizesPerDrink.set(s.drink_id, (sizesPerDrink.get(s.drink_id) ?? 0) + 1);
  const mix = new Map<string, WeeklyCups>();
  for (const s of sizes) {
    const q = sold.get(s.id);
    const e = expected.get(s.drink_id);
    if (q !== undefined) mix.set(s.id, { cups: dec(q).div(SALES_WEEKS), source: 'sales' });
    else if (e !== undefined) mix.set(s.id, { cups: new D(e).div(sizesPerDrink.get(s.drink_id) as number), source: 'expected' });
    else mix.set(s.id, { cups: null, source: null });
  }
  return { mix, salesFrom: from, salesTo: to };
}

function chosenPrice(d: Decision | undefined, current: Dec | null, suggested: Dec | null): Dec | null {
  if (!d || d.choice === 'keep') return current;
  if (d.choice === 'suggested') return suggested ?? current;
  return dec(d.price as string);
}

export interface ImpactOptions {
  /** "Today": the date of the costs before the change. */
  today?: string;
}

/**
 * The impact of proposed pack price changes on the whole menu, saving nothing.
 *
 * Before = the costs with the prices in force today; after = the costs with the prices in force
 * on `asOf` (default today: planned prices dated up to then included) and the typed changes on
 * top. Both come from the costing engine through ONE cost model each, so every figure equals
 * the engine's. Rows: every live drink × size whose build uses a changed ingredient directly or
 * through preparations at any depth; modifiers: every modifier × size that does. Sorted by
 * margin lost (points at the current price), then by the rise in cost.
 */
export async function previewImpact(db: Knex, businessId: string, input: PreviewInput, options: ImpactOptions = {}) {
  const now = options.today ?? today();
  const asOf = input.asOf ?? now;
  const overrides = new Map(input.changes.map((c) => [c.ingredientId, c.newPrice]));
  // One set of cost rows serves both models when both are costed today (the usual case).
  const [menu, rowsNow, rowsLater, modifierLines] = await Promise.all([
    loadMenuRows(db, businessId),
    loadCostRows(db, businessId, now),
    asOf === now ? null : loadCostRows(db, businessId, asOf),
    listModifierLines(db, businessId),
  ]);
  const before = buildLoadedCostModel(rowsNow, { asOf: now });
  const after = buildLoadedCostModel(rowsLater ?? rowsNow, { asOf, priceOverrides: overrides });
  const { currency } = before;

  const fields: Record<string, string> = {};
  const seenIds = new Set<string>();
  input.changes.forEach((c, i) => {
    const ing = before.ingredients.get(c.ingredientId);
    if (!ing) fields[`changes[${i}].ingredientId`] = 'That ingredient was not found.';
    else if (!after.ingredients.get(c.ingredientId)?.costingPack) fields[`changes[${i}].ingredientId`] = `${ing.row.name} has no pack with a price yet: add one first.`;
    if (seenIds.has(c.ingredientId)) fields[`changes[${i}].ingredientId`] = 'That ingredient is listed twice.';
    seenIds.add(c.ingredientId);
  });
  if (Object.keys(fields).length) throw invalidInput(fields);

  // Changed = typed changes plus any ingredient whose cost moves by the later date (planned prices).
  const changed = new Set<string>(overrides.keys());
  for (const [id, ing] of after.ingredients) {
    const was = before.ingredients.get(id)?.unitCost ?? null;
    const now2 = ing.unitCost;
    if ((was === null) !== (now2 === null) || (was && now2 && !was.eq(now2))) changed.add(id);
  }
  const preps = affectedPreparations(after, changed);

  const changes = [...changed].map((id) => {
    const b = before.ingredients.get(id);
    const a = after.ingredients.get(id);
    const oldPrice = b?.costingPack ? dec(b.costingPack.price) : null;
    const newPrice = a?.costingPack ? dec(a.costingPack.price) : null;
    return {
      ingredientId: id,
      ingredientName: after.itemName(id),
      packId: a?.costingPack?.id ?? null,
      packDescription: a?.costingPack?.description ?? null,
      oldPrice: oldPrice && writeMoney(oldPrice, currency),
      newPrice: newPrice && writeMoney(newPrice, currency),
      changePct: oldPrice && newPrice && !oldPrice.isZero() ? writePercent(newPrice.minus(oldPrice).times(100).div(oldPrice)) : null,
      oldUnitCost: cost(b?.unitCost ?? null),
      newUnitCost: cost(a?.unitCost ?? null),
      source: overrides.has(id) ? ('typed' as const) : ('planned' as const),
    };
  });

  const { mix, salesFrom, salesTo } = await weeklyMix(db, businessId, menu.sizes, now);
  const linesBySize = groupBy(menu.lines, (l) => l.drink_size_id);
  const sizesByDrink = groupBy(menu.sizes, (s) => s.drink_id);
  const decisions = new Map((input.decisions ?? []).map((d) => [d.drinkSizeId, d]));

  const rows: ReturnType<typeof makeRow>[] = [];
  const extraPrices: { size: DrinkSizeRow; drink: (typeof menu.drinks)[number]; price: Dec; cups: WeeklyCups; net: (p: Dec) => ExactPriceFigures }[] = [];

  function makeRow(drink: (typeof menu.drinks)[number], s: DrinkSizeRow, lines: BuildLineRow[], usage: Usage) {
    const policy = after.policyFor(drink.category);
    const parsed = parsePolicy(policy, currency);
    const was = before.costStoredLines(lines);
    const now3 = after.costStoredLines(lines);
    const current = s.price === null ? null : dec(s.price);
    const oldCost = was.ok ? was.cost : null;
    const newCost = now3.ok ? now3.cost : null;
    const atOld = current && oldCost ? exactPriceFigures(current, oldCost, parsed) : null;
    const atNew = current && newCost ? exactPriceFigures(current, newCost, parsed) : null;
    const suggested = newCost ? roundPrice(grossForTargetMargin(newCost, parsed), parsed) : null;
    const change = oldCost && newCost ? newCost.minus(oldCost) : null;
    const mixed = mix.get(s.id) as WeeklyCups;
    const via = [...(usage.direct.size ? ['direct'] : []), ...(usage.preparations.size ? ['preparation'] : [])] as ('direct' | 'preparation')[];
    const marginLost = atOld?.marginPct && atNew?.marginPct ? atOld.marginPct.minus(atNew.marginPct) : null;
    return {
      drinkId: drink.id,
      drinkName: drink.name,
      category: drink.category,
      drinkSizeId: s.id,
      sizeId: s.size_id,
      size: s.size_name,
      sizePosition: s.position,
      priceVersion: s.price_version,
      via,
      through: [...usage.preparations].map((id) => after.itemName(id)).sort(),
      ingredients: [...usage.ingredients].map((id) => after.itemName(id)).sort(),
      oldCost: cost(oldCost),
      newCost: cost(newCost),
      costChange: cost(change),
      costChangePct: change && oldCost && !oldCost.isZero() ? writePercent(change.times(HUNDRED).div(oldCost)) : null,
      currentPrice: current && writeMoney(current, currency),
      oldMarginPct: pct(atOld?.marginPct ?? null),
      newMarginPct: pct(atNew?.marginPct ?? null),
      marginLostPct: pct(marginLost),
      targetMarginPct: parsed.margin.toFixed(),
      // Compared unrounded, as the menu costing does.
      wasBelowTarget: Boolean(atOld?.marginPct && atOld.marginPct.lt(parsed.margin)),
      belowTarget: Boolean(atNew?.marginPct && atNew.marginPct.lt(parsed.margin)),
      suggestedPrice: suggested && writeMoney(suggested, currency),
      weeklyCups: mixed.cups && mixed.cups.toDecimalPlaces(2, D.ROUND_HALF_UP).toFixed(),
      cupsSource: mixed.source,
      weeklyCostIncrease: change && mixed.cups ? writeMoney(change.times(mixed.cups), currency) : null,
      monthlyCostIncrease: change && mixed.cups ? writeMoney(change.times(mixed.cups).times(WEEKS_PER_MONTH), currency) : null,
      decision: decisions.get(s.id)?.choice ?? 'keep',
      newPrice: null as string | null,
      newPriceMarginPct: null as string | null,
      newPriceBelowTarget: false,
      problem: !was.ok ? was.problem : !now3.ok ? now3.problem : null,
      // Kept unrounded for sorting, totals and the ladder; not sent.
      _: { current, oldCost, newCost, change, suggested, marginLost, cups: mixed.cups, parsed, atOld },
    };
  }

  for (const drink of menu.drinks) {
    const drinkRows: ReturnType<typeof makeRow>[] = [];
    const sizes = sizesByDrink.get(drink.id) ?? [];
    for (const s of sizes) {
      const lines = linesBySize.get(s.id) ?? [];
      const usage = usageOf(lines, changed, preps);
      if (usage) drinkRows.push(makeRow(drink, s, lines, usage));
    }
    if (!drinkRows.length) continue;
    // The prices chosen, per size of this drink (sizes not affected keep theirs), then the ladder.
    const chosen = new Map<string, Dec | null>();
    for (const s of sizes) {
      const row = drinkRows.find((r) => r.drinkSizeId === s.id);
      const current = s.price === null ? null : dec(s.price);
      chosen.set(s.id, row ? chosenPrice(decisions.get(s.id), current, row._.suggested) : current);
    }
    const finalPrices = input.keepLadder
      ? keepLadder(sizes.map((s) => ({ id: s.id, current: s.price === null ? null : dec(s.price), chosen: chosen.get(s.id) ?? null })))
      : chosen;
    for (const s of sizes) {
      const price = finalPrices.get(s.id) ?? null;
      const row = drinkRows.find((r) => r.drinkSizeId === s.id);
      if (row) {
        row.newPrice = price && writeMoney(price, currency);
        const at = price && row._.newCost ? exactPriceFigures(price, row._.newCost, row._.parsed) : null;
        row.newPriceMarginPct = pct(at?.marginPct ?? null);
        row.newPriceBelowTarget = Boolean(at?.marginPct && at.marginPct.lt(row._.parsed.margin));
      } else if (price && s.price !== null && !price.eq(dec(s.price))) {
        // Moved only to keep the ladder: its cost does not change.
        const parsed = parsePolicy(after.policyFor(drink.category), currency);
        extraPrices.push({ size: s, drink, price, cups: mix.get(s.id) as WeeklyCups, net: (p) => exactPriceFigures(p, new D(0), parsed) });
      }
    }
    rows.push(...drinkRows);
  }

  rows.sort((a, b) => {
    const ma = a._.marginLost;
    const mb = b._.marginLost;
    if (ma && mb && !ma.eq(mb)) return mb.comparedTo(ma);
    if (ma && !mb) return -1;
    if (!ma && mb) return 1;
    const ca = a._.change ?? new D(0);
    const cb = b._.change ?? new D(0);
    if (!ca.eq(cb)) return cb.comparedTo(ca);
    return a.drinkName.localeCompare(b.drinkName) || a.sizePosition - b.sizePosition;
  });

  // Totals over the rows whose cups a week are known.
  let weeklyCost = new D(0);
  let weeklyProfitChange = new D(0);
  let withCups = 0;
  for (const r of rows) {
    const { cups, change, current, newCost, oldCost, parsed, atOld } = r._;
    if (!cups || !change) continue;
    withCups++;
    weeklyCost = weeklyCost.plus(change.times(cups));
    const price = r.newPrice === null ? current : dec(r.newPrice);
    if (price && newCost && oldCost && atOld) {
      const profitAfter = exactPriceFigures(price, newCost, parsed).profit;
      weeklyProfitChange = weeklyProfitChange.plus(profitAfter.minus(atOld.profit).times(cups));
    }
  }
  for (const e of extraPrices) {
    if (!e.cups.cups || e.size.price === null) continue;
    weeklyProfitChange = weeklyProfitChange.plus(e.net(e.price).netPrice.minus(e.net(dec(e.size.price)).netPrice).times(e.cups.cups));
  }

  const prices = [
    ...rows
      .filter((r) => r.newPrice !== null && (r.currentPrice === null || !dec(r.newPrice).eq(dec(r.currentPrice))))
      .map((r) => ({ drinkId: r.drinkId, drinkName: r.drinkName, drinkSizeId: r.drinkSizeId, size: r.size, oldPrice: r.currentPrice, price: r.newPrice as string, priceVersion: r.priceVersion, ladderOnly: false })),
    ...extraPrices.map((e) => ({
      drinkId: e.drink.id,
      drinkName: e.drink.name,
      drinkSizeId: e.size.id,
      size: e.size.size_name,
      oldPrice: writeMoney(e.size.price as string, currency),
      price: writeMoney(e.price, currency),
      priceVersion: e.size.price_version,
      ladderOnly: true,
    })),
  ];

  const modifiers = modifierImpact(before, after, modifierLines, changed, preps);

  return {
    currency,
    asOf: now,
    pricesAsOf: asOf,
    changes,
    rows: rows.map(({ _, sizePosition: _p, ...r }) => r),
    modifiers,
    prices,
    totals: {
      rows: rows.length,
      drinks: new Set(rows.map((r) => r.drinkId)).size,
      wasBelowTarget: rows.filter((r) => r.wasBelowTarget).length,
      belowTarget: rows.filter((r) => r.belowTarget).length,
      belowTargetAtNewPrices: rows.filter((r) => r.newPriceBelowTarget).length,
      pricesChanged: prices.length,
      rowsWithCups: withCups,
      rowsWithoutCups: rows.length - withCups,
      salesFrom,
      salesTo,
      weeklyCostIncrease: writeMoney(weeklyCost, currency),
      monthlyCostIncrease: writeMoney(weeklyCost.times(WEEKS_PER_MONTH), currency),
      weeklyProfitChange: writeMoney(weeklyProfitChange, currency),
      monthlyProfitChange: writeMoney(weeklyProfitChange.times(WEEKS_PER_MONTH), currency),
    },
  };
}

export type Impact = Awaited<ReturnType<typeof previewImpact>>;

/**
 * Modifiers × size whose lines use a changed item: the extra cost (added − removed lines) before
 * and after, and the margin at the set upcharge against the business's target, with the
 * upcharge that would keep it.
 */
function modifierImpact(before: LoadedCostModel, after: LoadedCostModel, lines: ModifierLineRow[], changed: ReadonlySet<string>, preps: ReadonlyMap<string, Set<string>>) {
  const { currency } = after;
  const policy = after.defaultPolicy;
  const parsed = parsePolicy(policy, currency);
  const out = [];
  for (const group of groupBy(lines, (l) => `${l.modifier_id}|${l.size_id}`).values()) {
    const usage = usageOf(group, changed, preps);
    if (!usage) continue;
    const first = group[0];
    const delta = (m: LoadedCostModel) => {
      const add = m.costStoredLines(group.filter((l) => l.action === 'add'));
      const remove = m.costStoredLines(group.filter((l) => l.action === 'remove'));
      return add.ok && remove.ok ? add.cost.minus(remove.cost) : null;
    };
    const was = delta(before);
    const now = delta(after);
    const upcharge = first.upcharge === null ? null : dec(first.upcharge);
    const atOld = upcharge && was !== null && upcharge.gt(0) ? exactPriceFigures(upcharge, was, parsed) : null;
    const atNew = upcharge && now !== null && upcharge.gt(0) ? exactPriceFigures(upcharge, now, parsed) : null;
    out.push({
      modifierId: first.modifier_id,
      modifierName: first.modifier_name,
      kind: first.kind,
      sizeId: first.size_id,
      size: first.size_name,
      ingredients: [...usage.ingredients].map((id) => after.itemName(id)).sort(),
      oldCostDelta: cost(was),
      newCostDelta: cost(now),
      upcharge: upcharge && writeMoney(upcharge, currency),
      oldMarginPct: pct(atOld?.marginPct ?? null),
      newMarginPct: pct(atNew?.marginPct ?? null),
      belowTarget: Boolean(atNew?.marginPct && atNew.marginPct.lt(parsed.margin)),
      suggestedUpcharge: now === null ? null : writeMoney(roundPrice(grossForTargetMargin(now, parsed), parsed), currency),
    });
  }
  return out.sort((a, b) => a.modifierName.localeCompare(b.modifierName));
}

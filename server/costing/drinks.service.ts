import type { z } from 'zod';
import type { copyBuildSchema, Drink, DrinkSummary, drinkInSchema } from '../../src/shared/contract/costing';
import { dec } from '../../src/shared/decimal';
import { businessToday } from '../platform/clock';
import { guardWrite } from '../platform/db-errors';
import type { AppDeps } from '../platform/deps';
import { invalidInput, notFound } from '../platform/errors';
import { foldDuePrices } from '../repricing/schedule.repo';
import { findBusinessMoney, loadMenuRows } from './cost-model.repo';
import { presentDrink, presentDrinkSummaries } from './drinks.presenter';
import {
  archiveDrink,
  deleteDrinkSizes,
  findLiveDrink,
  insertDrink,
  insertDrinkSize,
  insertPriceHistory,
  loadLineNames,
  lockDrinkSizes,
  replaceBuildLines,
  setDrinkSizePrice,
  updateDrink,
  type DrinkColumns,
} from './drinks.repo';
import { checkLines, throwIfFields } from './lines.service';
import { knownSizeIds } from './sizes.repo';

type DrinkIn = z.output<typeof drinkInSchema>;

export async function list(deps: AppDeps, businessId: string): Promise<DrinkSummary[]> {
  const asOf = await businessToday(deps.db, deps.clock, businessId);
  const [rows, business] = await Promise.all([loadMenuRows(deps.db, businessId, undefined, asOf), findBusinessMoney(deps.db, businessId)]);
  return presentDrinkSummaries(rows, business.currency);
}

export async function get(deps: AppDeps, businessId: string, id: string): Promise<Drink> {
  const { db } = deps;
  const drink = await findLiveDrink(db, businessId, id);
  if (!drink) throw notFound('That drink');
  const asOf = await businessToday(db, deps.clock, businessId);
  const [rows, business, names] = await Promise.all([loadMenuRows(db, businessId, id, asOf), findBusinessMoney(db, businessId), loadLineNames(db, businessId, id)]);
  return presentDrink(drink, rows, business.currency, names);
}

/** Every cup size is this business's and listed once; every line names a live item of it. */
async function validate({ db }: AppDeps, businessId: string, input: DrinkIn) {
  const fields: Record<string, string> = {};
  const known = await knownSizeIds(db, businessId, input.sizes.map((s) => s.sizeId));
  const seen = new Set<string>();
  input.sizes.forEach((s, i) => {
    if (!known.has(s.sizeId)) fields[`sizes[${i}].sizeId`] = 'That cup size was not found.';
    else if (seen.has(s.sizeId)) fields[`sizes[${i}].sizeId`] = 'This cup size is listed twice.';
    seen.add(s.sizeId);
  });
  for (const [i, s] of input.sizes.entries()) Object.assign(fields, await checkLines(db, businessId, s.lines, (j) => `sizes[${i}].lines[${j}]`));
  throwIfFields(fields);
}

const samePrice = (a: string | null, b: string | null) => (a === null || b === null ? a === b : dec(a).eq(dec(b)));

/** Writes the drink's sizes, their builds and price changes inside `trx`. */
async function writeSizes(trx: AppDeps['db'], businessId: string, userId: string, drinkId: string, input: DrinkIn, today: string) {
  const existing = await lockDrinkSizes(trx, businessId, drinkId);
  await foldDuePrices(trx, businessId, existing, today); // planned menu prices now due go in first (repricing)
  const bySize = new Map(existing.map((e) => [e.size_id, e]));
  const keep = new Set(input.sizes.map((s) => s.sizeId));
  await deleteDrinkSizes(trx, businessId, existing.filter((e) => !keep.has(e.size_id)).map((e) => e.id));
  for (const s of input.sizes) {
    const price = s.currentPrice ?? null;
    const old = bySize.get(s.sizeId);
    let drinkSizeId: string;
    if (old) {
      drinkSizeId = old.id;
      if (!samePrice(old.price, price)) {
        await setDrinkSizePrice(trx, businessId, drinkSizeId, price);
        if (price !== null) {
          await insertPriceHistory(trx, businessId, { drink_size_id: drinkSizeId, old_price: old.price, new_price: price, effective_from: today, reason: 'Edited in the drink editor', changed_by: userId });
        }
      }
    } else {
      drinkSizeId = await insertDrinkSize(trx, businessId, drinkId, s.sizeId, price);
      if (price !== null) {
        await insertPriceHistory(trx, businessId, { drink_size_id: drinkSizeId, old_price: null, new_price: price, effective_from: today, reason: 'First price', changed_by: userId });
      }
    }
    await replaceBuildLines(trx, businessId, drinkSizeId, s.lines);
  }
}

function columns(input: DrinkIn): DrinkColumns {
  return { name: input.name, category: input.category, temperature: input.temperature, notes: input.notes ?? null, expected_weekly_cups: input.expectedWeeklyCups ?? null };
}

export async function create(deps: AppDeps, businessId: string, userId: string, input: DrinkIn): Promise<Drink> {
  await validate(deps, businessId, input);
  const today = await businessToday(deps.db, deps.clock, businessId);
  const id = await guardWrite('A drink', () =>
    deps.db.transaction(async (trx) => {
      const drinkId = await insertDrink(trx, businessId, columns(input));
      await writeSizes(trx, businessId, userId, drinkId, input, today);
      return drinkId;
    }),
  );
  return get(deps, businessId, id);
}

/** PUT: the whole drink, its sizes and their lines replaced in one transaction. */
export async function replace(deps: AppDeps, businessId: string, userId: string, id: string, input: DrinkIn): Promise<Drink> {
  if (!(await findLiveDrink(deps.db, businessId, id))) throw notFound('That drink');
  await validate(deps, businessId, input);
  const today = await businessToday(deps.db, deps.clock, businessId);
  await guardWrite('A drink', () =>
    deps.db.transaction(async (trx) => {
      await updateDrink(trx, businessId, id, columns(input));
      await writeSizes(trx, businessId, userId, id, input, today);
    }),
  );
  return get(deps, businessId, id);
}

/** Archived, not deleted: its price history and past sales keep pointing at it. */
export async function archive({ db }: AppDeps, businessId: string, id: string): Promise<void> {
  if (!(await archiveDrink(db, businessId, id))) throw notFound('That drink');
}

/** Copies one size's build onto another (adding the size if the drink does not offer it yet). */
export async function copyBuild(deps: AppDeps, businessId: string, userId: string, id: string, { fromSizeId, toSizeId }: z.output<typeof copyBuildSchema>): Promise<Drink> {
  const drink = await get(deps, businessId, id);
  const source = drink.sizes.find((s) => s.sizeId === fromSizeId);
  if (!source) throw invalidInput({ fromSizeId: 'This drink does not offer that cup size.' });
  if (fromSizeId === toSizeId) throw invalidInput({ toSizeId: 'Choose a different cup size to copy to.' });
  if (!(await knownSizeIds(deps.db, businessId, [toSizeId])).has(toSizeId)) throw invalidInput({ toSizeId: 'That cup size was not found.' });
  const asInput = (lines: typeof source.lines) =>
    lines.map((l) => ({ ingredientId: l.ingredientId, preparationId: l.preparationId, quantity: l.quantity, unit: l.unit, measureId: l.measureId }));
  const sizes: DrinkIn['sizes'] = drink.sizes.map((s) => ({ sizeId: s.sizeId, currentPrice: s.currentPrice, lines: asInput(s.sizeId === toSizeId ? source.lines : s.lines) }));
  if (!sizes.some((s) => s.sizeId === toSizeId)) sizes.push({ sizeId: toSizeId, currentPrice: null, lines: asInput(source.lines) });
  const input: DrinkIn = { name: drink.name, category: drink.category, temperature: drink.temperature, notes: drink.notes, expectedWeeklyCups: drink.expectedWeeklyCups, sizes };
  return replace(deps, businessId, userId, id, input);
}

import type { Knex } from 'knex';
import type { CardSummary, DrinkCosting, RecipeCard } from '../../src/shared/contract/costing';
import { businessToday } from '../platform/clock';
import type { AppDeps } from '../platform/deps';
import { notFound } from '../platform/errors';
import { cacheFor, costingVersion } from '../platform/versions';
import { loadMenuRows } from './cost-model.repo';
import { dayOrToday, loadCostModel, type CostModelOptions } from './cost-model.service';
import { findLiveDrink, listAddedItems, listCardRows } from './drinks.repo';
import { menuCostingFrom, presentCard, presentCards, presentDrinkCosting, type MenuCosting } from './menu.presenter';

export type { MenuCosting };

/** A saved drink costed on `asOf` (default the business's today), with the menu prices in force that day. */
export async function drinkCosting(deps: AppDeps, businessId: string, drinkId: string, asOf?: string): Promise<DrinkCosting> {
  const day = asOf ?? (await businessToday(deps.db, deps.clock, businessId));
  const rows = await loadMenuRows(deps.db, businessId, drinkId, day);
  if (!rows.drinks[0]) throw notFound('That drink');
  return presentDrinkCosting(await loadCostModel(deps.db, businessId, { asOf: day }), rows);
}

/** The costed menu on `asOf`, default the business's today by deps.clock. */
export async function costedMenu(deps: AppDeps, businessId: string, asOf?: string): Promise<MenuCosting> {
  return menuCosting(deps.db, businessId, { asOf: asOf ?? (await businessToday(deps.db, deps.clock, businessId)) });
}

/**
 * Every live drink × size costed from ONE cost model and three menu queries. An unchanged menu
 * is not costed again: the result is kept per business and date while the business's costing
 * version stays the same (read first; see versions.ts). Price overrides are never kept.
 */
export async function menuCosting(db: Knex, businessId: string, options: CostModelOptions = {}): Promise<MenuCosting> {
  const asOf = await dayOrToday(db, businessId, options.asOf);
  const compute = async () => {
    const [rows, loaded] = await Promise.all([loadMenuRows(db, businessId, undefined, asOf), loadCostModel(db, businessId, { ...options, asOf })]);
    return menuCostingFrom(loaded, rows);
  };
  if (options.priceOverrides) return compute();
  const version = await costingVersion(db, businessId);
  return cacheFor<MenuCosting>(db, 'menu-costing', MENU_CACHE_LIMIT).get(`${businessId}|${asOf}`, version, compute);
}

/** Menus kept per database handle (a business and a date each). */
const MENU_CACHE_LIMIT = 200;

export async function cards({ db }: AppDeps, businessId: string): Promise<CardSummary[]> {
  return presentCards(await listCardRows(db, businessId));
}

export async function card(deps: AppDeps, businessId: string, drinkId: string): Promise<RecipeCard> {
  const { db } = deps;
  const drink = await findLiveDrink(db, businessId, drinkId);
  if (!drink) throw notFound('That drink');
  const asOf = await businessToday(db, deps.clock, businessId);
  const [rows, loaded, added] = await Promise.all([loadMenuRows(db, businessId, drinkId, asOf), loadCostModel(db, businessId, { asOf }), listAddedItems(db, businessId)]);
  return presentCard(drink, rows, loaded, added);
}

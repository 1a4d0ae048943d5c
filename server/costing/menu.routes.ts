import { Router } from 'express';
import { getCard, getDrinkCosting, getMenuCosting, listCards } from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import * as menu from './menu.service';

export function menuRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(getMenuCosting, ({ user, query }) => menu.costedMenu(deps, user.businessId, query.asOf));
  on(getDrinkCosting, ({ user, params, query }) => menu.drinkCosting(deps, user.businessId, params.id, query.asOf));
  on(listCards, async ({ user }) => ({ cards: await menu.cards(deps, user.businessId) }));
  on(getCard, async ({ user, params }) => ({ card: await menu.card(deps, user.businessId, params.id) }));
  return r;
}

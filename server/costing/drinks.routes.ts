import { Router } from 'express';
import { archiveDrink, copyBuild, createDrink, getDrink, listDrinks, replaceDrink } from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import * as drinks from './drinks.service';

export function drinksRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(listDrinks, async ({ user }) => ({ drinks: await drinks.list(deps, user.businessId) }));
  on(getDrink, async ({ user, params }) => ({ drink: await drinks.get(deps, user.businessId, params.id) }));
  on(createDrink, async ({ user, body }) => ({ drink: await drinks.create(deps, user.businessId, user.id, body) }));
  on(replaceDrink, async ({ user, params, body }) => ({ drink: await drinks.replace(deps, user.businessId, user.id, params.id, body) }));
  on(archiveDrink, ({ user, params }) => drinks.archive(deps, user.businessId, params.id));
  on(copyBuild, async ({ user, params, body }) => ({ drink: await drinks.copyBuild(deps, user.businessId, user.id, params.id, body) }));
  return r;
}

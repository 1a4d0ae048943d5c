import { Router } from 'express';
import {
  addIngredientMeasure,
  addPack,
  addPackPrice,
  addPreparationMeasure,
  createIngredient,
  deleteIngredient,
  deleteMeasure,
  deletePack,
  getIngredient,
  listIngredients,
  listPackPrices,
  updateIngredient,
  updateMeasure,
  updatePack,
} from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import * as ingredients from './ingredients.service';
import * as measures from './measures.service';

export function ingredientsRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(listIngredients, ({ user }) => ingredients.list(deps, user.businessId));
  on(getIngredient, ({ user, params }) => ingredients.get(deps, user.businessId, params.id));
  on(createIngredient, ({ user, body }) => ingredients.create(deps, user.businessId, user.id, body));
  on(updateIngredient, ({ user, params, body }) => ingredients.update(deps, user.businessId, params.id, body));
  on(deleteIngredient, ({ user, params }) => ingredients.remove(deps, user.businessId, params.id));

  on(addPack, async ({ user, params, body }) => ({ pack: await ingredients.addPack(deps, user.businessId, user.id, params.id, body) }));
  on(updatePack, async ({ user, params, body }) => ({ pack: await ingredients.changePack(deps, user.businessId, params.id, body) }));
  on(deletePack, ({ user, params }) => ingredients.removePack(deps, user.businessId, params.id));
  on(listPackPrices, async ({ user, params }) => ({ prices: await ingredients.listPrices(deps, user.businessId, params.id) }));
  on(addPackPrice, ({ user, params, body }) => ingredients.addPrice(deps, user.businessId, user.id, params.id, body));

  on(addIngredientMeasure, async ({ user, params, body }) => ({ measure: await measures.add(deps, user.businessId, { ingredientId: params.id }, body) }));
  on(addPreparationMeasure, async ({ user, params, body }) => ({ measure: await measures.add(deps, user.businessId, { preparationId: params.id }, body) }));
  on(updateMeasure, async ({ user, params, body }) => ({ measure: await measures.update(deps, user.businessId, params.id, body) }));
  on(deleteMeasure, ({ user, params }) => measures.remove(deps, user.businessId, params.id));
  return r;
}

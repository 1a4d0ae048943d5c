import type { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { drinksRoutes } from './drinks.routes';
import { ingredientsRoutes } from './ingredients.routes';
import { menuRoutes } from './menu.routes';
import { modifiersRoutes } from './modifiers.routes';
import { policyRoutes } from './policy.routes';
import { preparationsRoutes } from './preparations.routes';
import { previewRoutes } from './preview.routes';
import { sizesRoutes } from './sizes.routes';

/** The costing domain's routers (suppliers are mounted on their own: the purchase-order work extends them). */
export function costingRouters(deps: AppDeps): Router[] {
  return [previewRoutes(deps), sizesRoutes(deps), ingredientsRoutes(deps), preparationsRoutes(deps), drinksRoutes(deps), menuRoutes(deps), modifiersRoutes(deps), policyRoutes(deps)];
}

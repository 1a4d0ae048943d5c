import { Router } from 'express';
import { createModifier, deleteModifier, getModifier, listModifiers, replaceModifier } from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import * as modifiers from './modifiers.service';

export function modifiersRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(listModifiers, async ({ user }) => ({ modifiers: await modifiers.list(deps, user.businessId) }));
  on(getModifier, async ({ user, params }) => ({ modifier: await modifiers.get(deps, user.businessId, params.id) }));
  on(createModifier, async ({ user, body }) => ({ modifier: await modifiers.create(deps, user.businessId, body) }));
  on(replaceModifier, async ({ user, params, body }) => ({ modifier: await modifiers.replace(deps, user.businessId, params.id, body) }));
  on(deleteModifier, ({ user, params }) => modifiers.remove(deps, user.businessId, params.id));
  return r;
}

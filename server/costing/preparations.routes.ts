import { Router } from 'express';
import { createPreparation, deletePreparation, getPreparation, listPreparations, replacePreparation } from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import * as preparations from './preparations.service';

export function preparationsRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(listPreparations, ({ user }) => preparations.list(deps, user.businessId));
  on(getPreparation, ({ user, params }) => preparations.get(deps, user.businessId, params.id));
  on(createPreparation, ({ user, body }) => preparations.create(deps, user.businessId, body));
  on(replacePreparation, ({ user, params, body }) => preparations.replace(deps, user.businessId, params.id, body));
  on(deletePreparation, ({ user, params }) => preparations.remove(deps, user.businessId, params.id));
  return r;
}

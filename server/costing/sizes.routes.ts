import { Router } from 'express';
import { createSize, deleteSize, listSizes, updateSize } from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import * as sizes from './sizes.service';

export function sizesRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(listSizes, async ({ user }) => ({ sizes: await sizes.list(deps, user.businessId) }));
  on(createSize, async ({ user, body }) => ({ size: await sizes.create(deps, user.businessId, body) }));
  on(updateSize, async ({ user, params, body }) => ({ size: await sizes.update(deps, user.businessId, params.id, body) }));
  on(deleteSize, async ({ user, params }) => sizes.remove(deps, user.businessId, params.id));
  return r;
}

import { Router } from 'express';
import { getPricingPolicy, savePricingPolicy } from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import * as policy from './policy.service';

export function policyRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(getPricingPolicy, ({ user }) => policy.get(deps, user.businessId));
  on(savePricingPolicy, ({ user, body }) => policy.save(deps, user.businessId, body));
  return r;
}

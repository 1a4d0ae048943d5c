import { Router } from 'express';
import { getBusiness, updateBusiness } from '../../src/shared/contract/business';
import { createSite, listSites, renameSite } from '../../src/shared/contract/sites';
import { businessOf } from '../auth/auth.service';
import type { BusinessRow } from '../auth/users.repo';
import type { AppDeps } from '../platform/deps';
import { notFound } from '../platform/errors';
import { endpointsOf } from '../platform/http/mount';
import * as repo from './business.repo';

/** The business's own settings and its sites. */
export function businessRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  const on = endpointsOf(r, deps);

  on(listSites, async ({ user }) => ({ sites: await repo.listSites(db, user.businessId) }));
  on(createSite, async ({ user, body }) => ({ site: await repo.insertSite(db, user.businessId, body.name) }));
  on(renameSite, async ({ user, params, body }) => {
    const site = await repo.renameSite(db, user.businessId, params.id, body.name);
    if (!site) throw notFound('That site');
    return { site };
  });

  on(getBusiness, async ({ user }) => ({ business: await businessOf(deps, user.businessId) }));
  on(updateBusiness, async ({ user, body }) => {
    const patch: Partial<Omit<BusinessRow, 'id'>> = {};
    if (body.name !== undefined) patch.name = body.name;
    if (body.country !== undefined) patch.country = body.country;
    if (body.currency !== undefined) patch.currency = body.currency;
    if (body.taxMode !== undefined) patch.tax_mode = body.taxMode;
    if (body.timeZone !== undefined) patch.time_zone = body.timeZone;
    if (body.taxName !== undefined) patch.tax_name = body.taxName;
    await repo.updateBusiness(db, user.businessId, patch);
    return { business: await businessOf(deps, user.businessId) };
  });
  return r;
}

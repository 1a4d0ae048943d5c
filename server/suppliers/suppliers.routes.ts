import { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import { createSupplier, deleteSupplier, getSupplier, listSuppliers, updateSupplier } from '../../src/shared/contract/suppliers';
import * as suppliers from './suppliers.service';

export function suppliersRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(listSuppliers, async ({ user }) => ({ suppliers: await suppliers.list(deps, user.businessId) }));
  on(getSupplier, async ({ user, params }) => ({ supplier: await suppliers.get(deps, user.businessId, params.id) }));
  on(createSupplier, async ({ user, body }) => ({ supplier: await suppliers.create(deps, user.businessId, body) }));
  on(updateSupplier, async ({ user, params, body }) => ({ supplier: await suppliers.update(deps, user.businessId, params.id, body) }));
  on(deleteSupplier, async ({ user, params }) => suppliers.remove(deps, user.businessId, params.id));
  return r;
}

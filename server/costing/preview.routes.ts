import { Router } from 'express';
import { previewCosting } from '../../src/shared/contract/costing';
import type { AppDeps } from '../platform/deps';
import { endpointsOf } from '../platform/http/mount';
import { preview } from './preview.service';

export function previewRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  // The drink editor calls it as the owner types.
  on(previewCosting, ({ body }) => preview(body));
  return r;
}

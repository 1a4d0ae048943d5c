import { Router } from 'express';
import { health, publicConfig as publicConfigEntry } from '../../src/shared/contract/system';
import { publicConfig } from '../platform/config';
import type { AppDeps } from '../platform/deps';
import { endpointsOf, Reply } from '../platform/http/mount';

/** Health and what the browser may know of the setup. */
export function systemRoutes(deps: AppDeps) {
  const r = Router();
  const on = endpointsOf(r, deps);
  on(health, async () => {
    try {
      await deps.db.raw('select 1');
      return { ok: true, db: 'up' as const };
    } catch {
      return new Reply(503, { ok: false, db: 'down' as const });
    }
  });
  on(publicConfigEntry, () => publicConfig(deps.config));
  return r;
}

import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../app';
import { allow, uuidParam } from '../http/middleware';
import { parse } from '../http/validate';
import { stockLevelSchema } from '../../src/shared/ordering';
import { presentStock, setLevel, suggestedOrder } from './stock.service';

export function stockRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('siteId', uuidParam);
  r.param('packId', uuidParam);

  r.get('/api/sites/:siteId/stock', allow('stock.read'), async (req, res) => {
    res.json(await presentStock(db, req.user!.businessId, String(req.params.siteId)));
  });

  r.put('/api/sites/:siteId/stock/:packId', allow('stock.manage'), async (req, res) => {
    const v = parse(stockLevelSchema, req.body);
    res.json({ item: await setLevel(db, req.user!.businessId, String(req.params.siteId), String(req.params.packId), v) });
  });

  r.get('/api/sites/:siteId/suggested-order', allow('orders.read'), async (req, res) => {
    const { supplierId } = parse(z.object({ supplierId: z.uuid({ error: 'Choose a supplier.' }) }), req.query);
    res.json(await suggestedOrder(db, req.user!.businessId, String(req.params.siteId), supplierId));
  });

  return r;
}

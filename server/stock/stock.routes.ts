import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../platform/deps';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { stockLevelSchema } from '../../src/shared/ordering';
import { packStorageAreaSchema, storageAreaInSchema, storageAreaOrderSchema, storageAreaPatchSchema } from '../../src/shared/schemas/stock';
import { presentStock, setLevel, suggestedOrder } from './stock.service';
import * as areas from './storage-areas.service';

export function stockRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('siteId', uuidParam);
  r.param('packId', uuidParam);
  r.param('areaId', uuidParam);

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

  // Storage areas: where packs are kept at a site, named and ordered by the business; the count sheet walks them in this order.
  r.get('/api/sites/:siteId/storage-areas', allow('stock.read'), async (req, res) => {
    res.json(await areas.listAreas(db, req.user!.businessId, String(req.params.siteId)));
  });
  r.post('/api/sites/:siteId/storage-areas', allow('stock.manage'), async (req, res) => {
    const v = parse(storageAreaInSchema, req.body ?? {});
    res.status(201).json(await areas.createArea(db, req.user!.businessId, String(req.params.siteId), v));
  });
  r.put('/api/sites/:siteId/storage-areas/order', allow('stock.manage'), async (req, res) => {
    const { areaIds } = parse(storageAreaOrderSchema, req.body ?? {});
    res.json(await areas.reorderAreas(db, req.user!.businessId, String(req.params.siteId), areaIds));
  });
  r.patch('/api/sites/:siteId/storage-areas/:areaId', allow('stock.manage'), async (req, res) => {
    const v = parse(storageAreaPatchSchema, req.body ?? {});
    res.json(await areas.updateArea(db, req.user!.businessId, String(req.params.siteId), String(req.params.areaId), v));
  });
  r.delete('/api/sites/:siteId/storage-areas/:areaId', allow('stock.manage'), async (req, res) => {
    await areas.deleteArea(db, req.user!.businessId, String(req.params.siteId), String(req.params.areaId));
    res.status(204).end();
  });
  r.put('/api/sites/:siteId/stock/:packId/storage-area', allow('stock.manage'), async (req, res) => {
    const v = parse(packStorageAreaSchema, req.body ?? {});
    res.json(await areas.assignPackArea(db, req.user!.businessId, String(req.params.siteId), String(req.params.packId), v));
  });

  return r;
}

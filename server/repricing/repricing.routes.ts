import { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { applySchema, compareQuerySchema, previewSchema, scenarioSchema } from '../../src/shared/schemas/repricing';
import { applyPrices } from './apply.service';
import { previewImpact } from './impact.service';
import { drinkPriceHistory, plannedChanges, priceList, priceListCsv } from './price-list.service';
import { cancelScheduled, scheduledPrices } from './scheduled.service';
import { utcToday as today } from '../platform/clock';
import { isoDate } from '../../src/shared/schemas/fields';
import { z } from 'zod';

const dateQuery = z.object({ date: isoDate.optional() });
import * as scenarios from './scenarios.service';

export function repricingRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);
  const id = (p: unknown) => String(p);

  // Preview and read: owner, manager, bookkeeper (prices.history). Apply and save: owner, manager.
  r.post('/api/reprice/preview', allow('prices.history'), async (req, res) => {
    res.json(await previewImpact(db, req.user!.businessId, parse(previewSchema, req.body)));
  });
  r.post('/api/reprice/apply', allow('prices.apply'), async (req, res) => {
    res.json(await applyPrices(db, req.user!.businessId, req.user!.id, parse(applySchema, req.body)));
  });
  r.get('/api/reprice/planned', allow('prices.history'), async (req, res) => {
    res.json(await plannedChanges(db, req.user!.businessId));
  });

  // Menu prices applied with a later date; cancelled before their date by owner or manager.
  r.get('/api/reprice/scheduled', allow('prices.history'), async (req, res) => {
    res.json(await scheduledPrices(db, req.user!.businessId));
  });
  r.post('/api/reprice/scheduled/:id/cancel', allow('prices.apply'), async (req, res) => {
    res.json(await cancelScheduled(db, req.user!.businessId, req.user!.id, id(req.params.id)));
  });

  r.get('/api/reprice/scenarios', allow('prices.history'), async (req, res) => {
    res.json(await scenarios.listAll(db, req.user!.businessId));
  });
  r.get('/api/reprice/compare', allow('prices.history'), async (req, res) => {
    const { ids } = parse(compareQuerySchema, req.query);
    res.json(await scenarios.compare(db, req.user!.businessId, ids));
  });
  r.get('/api/reprice/scenarios/:id', allow('prices.history'), async (req, res) => {
    res.json(await scenarios.getOne(db, req.user!.businessId, id(req.params.id)));
  });
  r.post('/api/reprice/scenarios', allow('prices.apply'), async (req, res) => {
    res.status(201).json(await scenarios.create(db, req.user!.businessId, req.user!.id, parse(scenarioSchema, req.body)));
  });
  r.put('/api/reprice/scenarios/:id', allow('prices.apply'), async (req, res) => {
    res.json(await scenarios.replace(db, req.user!.businessId, id(req.params.id), parse(scenarioSchema, req.body)));
  });
  r.delete('/api/reprice/scenarios/:id', allow('prices.apply'), async (req, res) => {
    await scenarios.remove(db, req.user!.businessId, id(req.params.id));
    res.status(204).end();
  });

  r.get('/api/drinks/:id/price-history', allow('prices.history'), async (req, res) => {
    res.json(await drinkPriceHistory(db, req.user!.businessId, id(req.params.id)));
  });

  // The price list is what the counter shows: every role may read and print it.
  r.get('/api/price-list', allow('cards.read'), async (req, res) => {
    const { date } = parse(dateQuery, req.query);
    res.json(await priceList(db, req.user!.businessId, date));
  });
  r.get('/api/price-list.csv', allow('cards.read'), async (req, res) => {
    const { date = today() } = parse(dateQuery, req.query);
    const csv = await priceListCsv(db, req.user!.businessId, date);
    res.setHeader('content-type', 'text/csv; charset=utf-8');
    res.setHeader('content-disposition', `attachment; filename="price-list-${date}.csv"`);
    res.send(csv);
  });

  return r;
}

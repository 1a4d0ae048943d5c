import { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { drinkCard, drinkCosting, listCards, menuCosting } from './menu.service';
import { asOfQuery } from '../../src/shared/schemas/fields';

export function menuRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/menu/costing', allow('costs.read'), async (req, res) => {
    const { asOf } = parse(asOfQuery, req.query);
    res.json(await menuCosting(db, req.user!.businessId, { asOf }));
  });

  r.get('/api/drinks/:id/costing', allow('costs.read'), async (req, res) => {
    const { asOf } = parse(asOfQuery, req.query);
    res.json(await drinkCosting(db, req.user!.businessId, String(req.params.id), { asOf }));
  });

  r.get('/api/cards', allow('cards.read'), async (req, res) => {
    res.json(await listCards(db, req.user!.businessId));
  });

  r.get('/api/drinks/:id/card', allow('cards.read'), async (req, res) => {
    res.json(await drinkCard(db, req.user!.businessId, String(req.params.id)));
  });

  return r;
}

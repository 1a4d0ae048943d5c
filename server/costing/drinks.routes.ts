import { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import * as drinks from './drinks.service';

export function drinksRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/drinks', allow('costs.read'), async (req, res) => {
    res.json(await drinks.listDrinks(db, req.user!.businessId));
  });
  r.get('/api/drinks/:id', allow('costs.read'), async (req, res) => {
    res.json(await drinks.getDrink(db, req.user!.businessId, String(req.params.id)));
  });
  r.post('/api/drinks', allow('costs.write'), async (req, res) => {
    const input = parse(drinks.drinkInSchema, req.body);
    res.status(201).json(await drinks.createDrink(db, req.user!.businessId, req.user!.id, input));
  });
  r.put('/api/drinks/:id', allow('costs.write'), async (req, res) => {
    const input = parse(drinks.drinkInSchema, req.body);
    res.json(await drinks.replaceDrink(db, req.user!.businessId, req.user!.id, String(req.params.id), input));
  });
  r.delete('/api/drinks/:id', allow('costs.write'), async (req, res) => {
    await drinks.archiveDrink(db, req.user!.businessId, String(req.params.id));
    res.status(204).end();
  });
  r.post('/api/drinks/:id/copy-build', allow('costs.write'), async (req, res) => {
    const { fromSizeId, toSizeId } = parse(drinks.copyBuildSchema, req.body);
    res.json(await drinks.copyBuild(db, req.user!.businessId, req.user!.id, String(req.params.id), fromSizeId, toSizeId));
  });

  return r;
}

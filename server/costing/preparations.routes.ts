import { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import * as preparations from './preparations.service';

export function preparationsRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/preparations', allow('costs.read'), async (req, res) => {
    res.json(await preparations.listPreparations(db, req.user!.businessId));
  });
  r.get('/api/preparations/:id', allow('costs.read'), async (req, res) => {
    res.json(await preparations.getPreparation(db, req.user!.businessId, String(req.params.id)));
  });
  r.post('/api/preparations', allow('costs.write'), async (req, res) => {
    const input = parse(preparations.preparationInSchema, req.body);
    res.status(201).json(await preparations.createPreparation(db, req.user!.businessId, input));
  });
  r.put('/api/preparations/:id', allow('costs.write'), async (req, res) => {
    const input = parse(preparations.preparationInSchema, req.body);
    res.json(await preparations.replacePreparation(db, req.user!.businessId, String(req.params.id), input));
  });
  r.delete('/api/preparations/:id', allow('costs.write'), async (req, res) => {
    await preparations.deletePreparation(db, req.user!.businessId, String(req.params.id));
    res.status(204).end();
  });

  return r;
}

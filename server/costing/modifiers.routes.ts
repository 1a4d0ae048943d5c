import { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import * as modifiers from './modifiers.service';

export function modifiersRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/modifiers', allow('costs.read'), async (req, res) => {
    res.json(await modifiers.listModifiers(db, req.user!.businessId));
  });
  r.get('/api/modifiers/:id', allow('costs.read'), async (req, res) => {
    res.json(await modifiers.getModifier(db, req.user!.businessId, String(req.params.id)));
  });
  r.post('/api/modifiers', allow('costs.write'), async (req, res) => {
    const input = parse(modifiers.modifierInSchema, req.body);
    res.status(201).json(await modifiers.createModifier(db, req.user!.businessId, input));
  });
  r.put('/api/modifiers/:id', allow('costs.write'), async (req, res) => {
    const input = parse(modifiers.modifierInSchema, req.body);
    res.json(await modifiers.replaceModifier(db, req.user!.businessId, String(req.params.id), input));
  });
  r.delete('/api/modifiers/:id', allow('costs.write'), async (req, res) => {
    await modifiers.deleteModifier(db, req.user!.businessId, String(req.params.id));
    res.status(204).end();
  });

  return r;
}

import { Router } from 'express';
import type { AppDeps } from '../platform/deps';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import * as ingredients from './ingredients.service';
import { addMeasure, deleteMeasure, updateMeasure } from './measures.service';

export function ingredientsRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);
  const id = (p: unknown) => String(p);

  r.get('/api/ingredients', allow('costs.read'), async (req, res) => {
    res.json(await ingredients.listIngredients(db, req.user!.businessId));
  });
  r.get('/api/ingredients/:id', allow('costs.read'), async (req, res) => {
    res.json(await ingredients.getIngredient(db, req.user!.businessId, id(req.params.id)));
  });
  r.post('/api/ingredients', allow('costs.write'), async (req, res) => {
    const input = parse(ingredients.ingredientInSchema, req.body);
    res.status(201).json(await ingredients.createIngredient(db, req.user!.businessId, req.user!.id, input));
  });
  r.patch('/api/ingredients/:id', allow('costs.write'), async (req, res) => {
    const input = parse(ingredients.ingredientPatchSchema, req.body);
    res.json(await ingredients.updateIngredient(db, req.user!.businessId, id(req.params.id), input));
  });
  r.delete('/api/ingredients/:id', allow('costs.write'), async (req, res) => {
    await ingredients.deleteIngredient(db, req.user!.businessId, id(req.params.id));
    res.status(204).end();
  });

  r.post('/api/ingredients/:id/packs', allow('costs.write'), async (req, res) => {
    const input = parse(ingredients.packInSchema, req.body);
    res.status(201).json(await ingredients.addPack(db, req.user!.businessId, req.user!.id, id(req.params.id), input));
  });
  r.patch('/api/packs/:id', allow('costs.write'), async (req, res) => {
    const input = parse(ingredients.packPatchSchema, req.body);
    res.json(await ingredients.updatePack(db, req.user!.businessId, id(req.params.id), input));
  });
  r.delete('/api/packs/:id', allow('costs.write'), async (req, res) => {
    await ingredients.deletePack(db, req.user!.businessId, id(req.params.id));
    res.status(204).end();
  });
  r.get('/api/packs/:id/prices', allow('costs.read'), async (req, res) => {
    res.json(await ingredients.listPackPrices(db, req.user!.businessId, id(req.params.id)));
  });
  r.post('/api/packs/:id/prices', allow('costs.write'), async (req, res) => {
    const input = parse(ingredients.priceInSchema, req.body);
    res.status(201).json(await ingredients.addPackPrice(db, req.user!.businessId, req.user!.id, id(req.params.id), input));
  });

  r.post('/api/ingredients/:id/measures', allow('costs.write'), async (req, res) => {
    const input = parse(ingredients.measureInSchema, req.body);
    res.status(201).json(await addMeasure(db, req.user!.businessId, { ingredientId: id(req.params.id) }, input));
  });
  r.post('/api/preparations/:id/measures', allow('costs.write'), async (req, res) => {
    const input = parse(ingredients.measureInSchema, req.body);
    res.status(201).json(await addMeasure(db, req.user!.businessId, { preparationId: id(req.params.id) }, input));
  });
  r.patch('/api/measures/:id', allow('costs.write'), async (req, res) => {
    const input = parse(ingredients.measureInSchema.partial(), req.body);
    res.json(await updateMeasure(db, req.user!.businessId, id(req.params.id), input));
  });
  r.delete('/api/measures/:id', allow('costs.write'), async (req, res) => {
    await deleteMeasure(db, req.user!.businessId, id(req.params.id));
    res.status(204).end();
  });

  return r;
}

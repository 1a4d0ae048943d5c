import { Router } from 'express';
import { z } from 'zod';
import { rules } from '../../src/shared/checks';
import type { AppDeps } from '../platform/deps';
import { notFound } from '../platform/errors';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { decimalString, name } from './shared';
import { guardWrite } from '../platform/db-errors';
import { qty } from '../platform/present';

const sizeSchema = z.object({ name: name('cup size'), volumeMl: decimalString(rules.positive), position: z.number().int().min(0).max(1000).optional() });
const COLS = ['id', 'name', 'volume_ml', 'position'];
const present = (r: { id: string; name: string; volume_ml: string; position: number }) => ({ id: r.id, name: r.name, volumeMl: qty(r.volume_ml), position: r.position });

export function sizesRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/sizes', allow('costs.read'), async (req, res) => {
    const rows = await db('cup_sizes').where({ business_id: req.user!.businessId }).orderBy([{ column: 'position' }, { column: 'volume_ml' }]).select(COLS);
    res.json({ sizes: rows.map(present) });
  });

  r.post('/api/sizes', allow('costs.write'), async (req, res) => {
    const input = parse(sizeSchema, req.body);
    const [row] = await guardWrite('A cup size', () =>
      db('cup_sizes').insert({ business_id: req.user!.businessId, name: input.name, volume_ml: input.volumeMl, position: input.position ?? 0 }).returning(COLS),
    );
    res.status(201).json({ size: present(row) });
  });

  r.patch('/api/sizes/:id', allow('costs.write'), async (req, res) => {
    const input = parse(sizeSchema.partial(), req.body);
    const patch: Record<string, unknown> = { updated_at: db.fn.now() };
    if (input.name !== undefined) patch.name = input.name;
    if (input.volumeMl !== undefined) patch.volume_ml = input.volumeMl;
    if (input.position !== undefined) patch.position = input.position;
    const [row] = await guardWrite('A cup size', () => db('cup_sizes').where({ business_id: req.user!.businessId, id: req.params.id }).update(patch).returning(COLS));
    if (!row) throw notFound('That cup size');
    res.json({ size: present(row) });
  });

  r.delete('/api/sizes/:id', allow('costs.write'), async (req, res) => {
    const n = await guardWrite('That cup size', () => db('cup_sizes').where({ business_id: req.user!.businessId, id: req.params.id }).delete());
    if (!n) throw notFound('That cup size');
    res.status(204).end();
  });

  return r;
}

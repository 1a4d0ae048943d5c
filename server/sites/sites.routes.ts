import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../platform/deps';
import { notFound } from '../platform/errors';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { findBusiness } from '../auth/users.repo';
import { signupSchema } from '../auth/auth.schemas';

const siteSchema = z.object({ name: z.string().trim().min(1, 'Name the site.').max(120) });
const businessPatch = z
  .object({
    name: signupSchema.shape.businessName,
    country: signupSchema.shape.country.unwrap(),
    currency: signupSchema.shape.currency,
    taxMode: signupSchema.shape.taxMode,
  })
  .partial();

export function sitesRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/sites', allow('sites.read'), async (req, res) => {
    const sites = await db('sites').where({ business_id: req.user!.businessId }).orderBy('created_at').select('id', 'name');
    res.json({ sites });
  });

  r.post('/api/sites', allow('business.manage'), async (req, res) => {
    const { name } = parse(siteSchema, req.body);
    const [site] = await db('sites').insert({ business_id: req.user!.businessId, name }).returning(['id', 'name']);
    res.status(201).json({ site });
  });

  r.patch('/api/sites/:id', allow('business.manage'), async (req, res) => {
    const { name } = parse(siteSchema, req.body);
    const [site] = await db('sites')
      .where({ id: req.params.id, business_id: req.user!.businessId })
      .update({ name, updated_at: db.fn.now() })
      .returning(['id', 'name']);
    if (!site) throw notFound('That site');
    res.json({ site });
  });

  r.get('/api/business', allow('sites.read'), async (req, res) => {
    res.json({ business: await findBusiness(db, req.user!.businessId) });
  });

  r.patch('/api/business', allow('business.manage'), async (req, res) => {
    const p = parse(businessPatch, req.body);
    const patch: Record<string, unknown> = { updated_at: db.fn.now() };
    if (p.name !== undefined) patch.name = p.name;
    if (p.country !== undefined) patch.country = p.country;
    if (p.currency !== undefined) patch.currency = p.currency;
    if (p.taxMode !== undefined) patch.tax_mode = p.taxMode;
    await db('businesses').where({ id: req.user!.businessId }).update(patch);
    res.json({ business: await findBusiness(db, req.user!.businessId) });
  });

  return r;
}

import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../app';
import { conflict, notFound } from '../errors';
import { allow, uuidParam } from '../http/middleware';
import { parse } from '../http/validate';
import { guardWrite, name, optionalText } from '../costing/shared';
import { deleteSupplier, findSupplier, insertSupplier, listSuppliers, supplierHasPacks, updateSupplier, type SupplierRow } from './suppliers.repo';

export const supplierSchema = z.object({
  name: name('supplier'),
  contactName: optionalText(120),
  orderEmail: z.email('Enter an e-mail address for orders.').nullish(),
  phone: optionalText(40),
  accountNumber: optionalText(60),
  notes: optionalText(),
});
type SupplierIn = Partial<z.output<typeof supplierSchema>>;

function columns(s: SupplierIn): Partial<SupplierRow> {
  const out: Partial<SupplierRow> = {};
  if (s.name !== undefined) out.name = s.name;
  if (s.contactName !== undefined) out.contact_name = s.contactName ?? null;
  if (s.orderEmail !== undefined) out.order_email = s.orderEmail ?? null;
  if (s.phone !== undefined) out.phone = s.phone ?? null;
  if (s.accountNumber !== undefined) out.account_number = s.accountNumber ?? null;
  if (s.notes !== undefined) out.notes = s.notes ?? null;
  return out;
}

export function presentSupplier(r: SupplierRow) {
  return { id: r.id, name: r.name, contactName: r.contact_name, orderEmail: r.order_email, phone: r.phone, accountNumber: r.account_number, notes: r.notes };
}

export function suppliersRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/suppliers', allow('costs.read'), async (req, res) => {
    res.json({ suppliers: (await listSuppliers(db, req.user!.businessId)).map(presentSupplier) });
  });

  r.get('/api/suppliers/:id', allow('costs.read'), async (req, res) => {
    const s = await findSupplier(db, req.user!.businessId, String(req.params.id));
    if (!s) throw notFound('That supplier');
    res.json({ supplier: presentSupplier(s) });
  });

  r.post('/api/suppliers', allow('costs.write'), async (req, res) => {
    const input = parse(supplierSchema, req.body);
    const s = await guardWrite('A supplier', () => insertSupplier(db, req.user!.businessId, columns(input)));
    res.status(201).json({ supplier: presentSupplier(s) });
  });

  r.patch('/api/suppliers/:id', allow('costs.write'), async (req, res) => {
    const input = parse(supplierSchema.partial(), req.body);
    const s = await guardWrite('A supplier', () => updateSupplier(db, req.user!.businessId, String(req.params.id), columns(input)));
    if (!s) throw notFound('That supplier');
    res.json({ supplier: presentSupplier(s) });
  });

  r.delete('/api/suppliers/:id', allow('costs.write'), async (req, res) => {
    const b = req.user!.businessId;
    const id = String(req.params.id);
    if (!(await findSupplier(db, b, id))) throw notFound('That supplier');
    // Packs would silently lose their supplier (ON DELETE SET NULL): ask first.
    if (await supplierHasPacks(db, b, id)) throw conflict('in_use', 'Packs are still bought from this supplier. Move or remove them first.');
    await deleteSupplier(db, b, id);
    res.status(204).end();
  });

  return r;
}

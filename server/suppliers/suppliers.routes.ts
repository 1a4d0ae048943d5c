import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../app';
import { conflict, notFound } from '../errors';
import { allow, uuidParam } from '../http/middleware';
import { parse } from '../http/validate';
import { guardWrite, name, optionalText } from '../costing/shared';
import { writeMoney } from '../../src/shared/money';
import { currencyOf, deleteSupplier, findSupplier, insertSupplier, listSuppliers, supplierHasPacks, updateSupplier, type SupplierDetails, type SupplierRow } from './suppliers.repo';

export const supplierSchema = z.object({
  name: name('supplier'),
  contactName: optionalText(120),
  orderEmail: z.email('Enter an e-mail address for orders.').nullish(),
  phone: optionalText(40),
  accountNumber: optionalText(60),
  notes: optionalText(),
});
type SupplierIn = Partial<z.output<typeof supplierSchema>>;

function columns(s: SupplierIn): Partial<SupplierDetails> {
  const out: Partial<SupplierDetails> = {};
  if (s.name !== undefined) out.name = s.name;
  if (s.contactName !== undefined) out.contact_name = s.contactName ?? null;
  if (s.orderEmail !== undefined) out.order_email = s.orderEmail ?? null;
  if (s.phone !== undefined) out.phone = s.phone ?? null;
  if (s.accountNumber !== undefined) out.account_number = s.accountNumber ?? null;
  if (s.notes !== undefined) out.notes = s.notes ?? null;
  return out;
}

/** A supplier with its ordering terms; money in the business's currency ("40.00"), delivery days as ISO weekdays (1 = Monday). */
export function presentSupplier(r: SupplierRow, currency: string) {
  return {
    id: r.id, name: r.name, contactName: r.contact_name, orderEmail: r.order_email, phone: r.phone, accountNumber: r.account_number, notes: r.notes,
    paymentTerms: r.payment_terms, minimumOrder: writeMoney(r.minimum_order, currency), deliveryDays: r.delivery_days, orderCutoff: r.order_cutoff,
    leadDays: r.lead_days, deliveryCharge: writeMoney(r.delivery_charge, currency),
  };
}

export function suppliersRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);

  r.get('/api/suppliers', allow('costs.read'), async (req, res) => {
    const b = req.user!.businessId;
    const [rows, currency] = await Promise.all([listSuppliers(db, b), currencyOf(db, b)]);
    res.json({ suppliers: rows.map((s) => presentSupplier(s, currency)) });
  });

  r.get('/api/suppliers/:id', allow('costs.read'), async (req, res) => {
    const s = await findSupplier(db, req.user!.businessId, String(req.params.id));
    if (!s) throw notFound('That supplier');
    res.json({ supplier: presentSupplier(s, await currencyOf(db, req.user!.businessId)) });
  });

  r.post('/api/suppliers', allow('costs.write'), async (req, res) => {
    const input = parse(supplierSchema, req.body);
    const s = await guardWrite('A supplier', () => insertSupplier(db, req.user!.businessId, columns(input)));
    res.status(201).json({ supplier: presentSupplier(s, await currencyOf(db, req.user!.businessId)) });
  });

  r.patch('/api/suppliers/:id', allow('costs.write'), async (req, res) => {
    const input = parse(supplierSchema.partial(), req.body);
    const s = await guardWrite('A supplier', () => updateSupplier(db, req.user!.businessId, String(req.params.id), columns(input)));
    if (!s) throw notFound('That supplier');
    res.json({ supplier: presentSupplier(s, await currencyOf(db, req.user!.businessId)) });
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

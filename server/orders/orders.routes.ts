import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../platform/deps';
import { notFound } from '../platform/errors';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { writeMoney, writeQuantity } from '../../src/shared/money';
import { editOrderSchema, newOrderSchema, receiveSchema, supplierOrderingSchema } from '../../src/shared/ordering';
import { businessOf, packsForOrder, supplierTerms } from './orders.repo';
import { invoiceFile, invoiceUpload, storeInvoice } from './invoice';
import * as orders from './orders.service';

const listQuery = z.object({
  siteId: z.uuid().optional(),
  supplierId: z.uuid().optional(),
  status: z.enum(['draft', 'placed', 'paid', 'part_received', 'received', 'closed', 'cancelled']).optional(),
});

function presentTerms(s: NonNullable<Awaited<ReturnType<typeof supplierTerms>>>, currency: string) {
  return {
    id: s.id, name: s.name, contactName: s.contact_name, orderEmail: s.order_email, phone: s.phone, accountNumber: s.account_number,
    minimumOrder: writeMoney(s.minimum_order, currency), deliveryDays: s.delivery_days, orderCutoff: s.order_cutoff, leadDays: s.lead_days,
    deliveryCharge: writeMoney(s.delivery_charge, currency), paymentTerms: s.payment_terms,
  };
}

/** Purchase orders, and the ordering side of a supplier (terms and catalogue). */
export function ordersRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();
  r.param('id', uuidParam);
  r.param('supplierId', uuidParam);
  const present = (businessId: string, id: string) => orders.presentOrder(deps, businessId, id);

  r.get('/api/purchase-orders', allow('orders.read'), async (req, res) => {
    const q = parse(listQuery, req.query);
    res.json({ orders: await orders.listPresented(deps, req.user!.businessId, q) });
  });

  r.post('/api/purchase-orders', allow('orders.write'), async (req, res) => {
    const id = await orders.createDraft(deps, req.user!, parse(newOrderSchema, req.body));
    res.status(201).json(await present(req.user!.businessId, id));
  });

  r.get('/api/purchase-orders/:id', allow('orders.read'), async (req, res) => {
    res.json(await present(req.user!.businessId, String(req.params.id)));
  });

  r.patch('/api/purchase-orders/:id', allow('orders.write'), async (req, res) => {
    const id = String(req.params.id);
    await orders.updateDraft(deps, req.user!, id, parse(editOrderSchema, req.body));
    res.json(await present(req.user!.businessId, id));
  });

  r.post('/api/purchase-orders/:id/place', allow('orders.write'), async (req, res) => {
    const id = String(req.params.id);
    await orders.placeOrder(deps, req.user!, id);
    res.json(await present(req.user!.businessId, id));
  });

  r.post('/api/purchase-orders/:id/cancel', allow('orders.write'), async (req, res) => {
    const id = String(req.params.id);
    await orders.cancelOrder(deps, req.user!, id);
    res.json(await present(req.user!.businessId, id));
  });

  r.post('/api/purchase-orders/:id/receive', allow('orders.write'), async (req, res) => {
    const id = String(req.params.id);
    const result = await orders.receiveOrder(deps, req.user!, id, parse(receiveSchema, req.body));
    res.json({ ...(await present(req.user!.businessId, id)), receipt: result });
  });

  r.post('/api/purchase-orders/:id/close', allow('orders.write'), async (req, res) => {
    const id = String(req.params.id);
    await orders.closeOrder(deps, req.user!, id);
    res.json(await present(req.user!.businessId, id));
  });

  r.post('/api/purchase-orders/:id/pack-prices', allow('orders.write'), async (req, res) => {
    const { packId } = parse(z.object({ packId: z.uuid({ error: 'Choose a pack.' }) }), req.body);
    res.status(201).json({ packPrice: await orders.acceptInvoicePrice(deps, req.user!, String(req.params.id), packId) });
  });

  r.post('/api/purchase-orders/:id/invoice', allow('orders.write'), invoiceUpload(deps), async (req, res) => {
    const id = String(req.params.id);
    await storeInvoice(deps, req.user!, id, req.file);
    res.status(201).json(await present(req.user!.businessId, id));
  });

  r.get('/api/purchase-orders/:id/invoice', allow('orders.read'), async (req, res) => {
    const f = await invoiceFile(deps, req.user!.businessId, String(req.params.id));
    res.setHeader('content-type', f.contentType);
    res.setHeader('content-disposition', `inline; filename="${f.name.replace(/[^\w.\- ]/g, '_')}"`);
    res.setHeader('cache-control', 'private, no-store');
    res.sendFile(f.full);
  });

  r.get('/api/suppliers/:supplierId/ordering', allow('orders.read'), async (req, res) => {
    const b = req.user!.businessId;
    const s = await supplierTerms(db, b, String(req.params.supplierId));
    if (!s) throw notFound('That supplier');
    res.json({ supplier: presentTerms(s, (await businessOf(db, b)).currency) });
  });

  r.put('/api/suppliers/:supplierId/ordering', allow('orders.write'), async (req, res) => {
    const b = req.user!.businessId;
    const id = String(req.params.supplierId);
    const v = parse(supplierOrderingSchema, req.body);
    const n = await db('suppliers').where({ business_id: b, id }).update({
      minimum_order: v.minimumOrder, delivery_days: [...v.deliveryDays].sort(), order_cutoff: v.orderCutoff, lead_days: v.leadDays,
      delivery_charge: v.deliveryCharge, payment_terms: v.paymentTerms, updated_at: db.fn.now(),
    });
    if (n === 0) throw notFound('That supplier');
    res.json({ supplier: presentTerms((await supplierTerms(db, b, id))!, (await businessOf(db, b)).currency) });
  });

  r.get('/api/suppliers/:supplierId/catalogue', allow('orders.read'), async (req, res) => {
    const b = req.user!.businessId;
    const id = String(req.params.supplierId);
    if (!(await supplierTerms(db, b, id))) throw notFound('That supplier');
    const ids = (await db('packs').where({ business_id: b, supplier_id: id }).whereNull('archived_at').select('id')).map((p) => p.id as string);
    const currency = (await businessOf(db, b)).currency;
    const packs = (await packsForOrder(db, b, ids, orders.localNow().date))
      .sort((x, y) => `${x.ingredient_name} ${x.description}`.localeCompare(`${y.ingredient_name} ${y.description}`));
    res.json({
      packs: packs.map((p) => ({
        id: p.id, description: `${p.ingredient_name}: ${p.description}`, ingredient: p.ingredient_name, supplierCode: p.supplier_code,
        price: p.price === null ? null : writeMoney(p.price, currency), taxPct: writeQuantity(p.purchase_tax_pct),
      })),
    });
  });

  return r;
}

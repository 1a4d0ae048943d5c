import type { Knex } from 'knex';
import type { AppDeps } from '../platform/deps';
import { can, type SessionUser } from '../auth/roles';
import { badGateway, conflict, forbidden, invalidInput, notFound } from '../platform/errors';
import { D, dec } from '../../src/shared/decimal';
import { currencyMinorUnits, writeMoney, writeQuantity } from '../../src/shared/money';
import { minimumShortfall, nextDeliveryDate, orderTotals } from '../../src/shared/ordering';
import type { z } from 'zod';
import type { editOrderSchema, newOrderSchema, receiveSchema } from '../../src/shared/ordering';
import { latestPayment } from '../payments/payments.repo';
import { presentPayment, refundPayment } from '../payments/payments.service';
import { orderPdf } from './order-pdf';
import {
  addEvent, businessOf, findOrder, listOrders, nextOrderNumber, orderEvents, orderLines, packsForOrder, receiptLinesOf, receiptsOf,
  siteOfBusiness, supplierTerms, type LineRow, type OrderRow, type SupplierTerms,
} from './orders.repo';

type NewOrder = z.output<typeof newOrderSchema>;
type EditOrder = z.output<typeof editOrderSchema>;
type Receive = z.output<typeof receiveSchema>;

/** The server's local calendar date and clock time: order days and cut-offs are local. */
export function localNow(now = new Date()): { date: string; time: string } {
  const p = (n: number) => String(n).padStart(2, '0');
  return { date: `${now.getFullYear()}-${p(now.getMonth() + 1)}-${p(now.getDate())}`, time: `${p(now.getHours())}:${p(now.getMinutes())}` };
}

const STATUS_WORDS: Record<OrderRow['status'], string> = {
  draft: 'draft', placed: 'placed', paid: 'paid', part_received: 'partly received', received: 'received', closed: 'closed', cancelled: 'cancelled',
};

/** Priced lines for an order: each pack from this supplier's catalogue, at the price in force today. */
async function priceLines(trx: Knex.Transaction, businessId: string, supplier: SupplierTerms, lines: NewOrder['lines'], currency: string) {
  const fields: Record<string, string> = {};
  const seen = new Set<string>();
  lines.forEach((l, i) => {
    if (seen.has(l.packId)) fields[`lines[${i}].packId`] = 'This pack is already on the order: change that line’s quantity instead.';
    seen.add(l.packId);
  });
  const packs = new Map((await packsForOrder(trx, businessId, lines.map((l) => l.packId), localNow().date)).map((p) => [p.id, p]));
  lines.forEach((l, i) => {
    const pack = packs.get(l.packId);
    if (!pack) fields[`lines[${i}].packId`] = 'That pack was not found.';
    else if (pack.supplier_id !== supplier.id) fields[`lines[${i}].packId`] = `That pack is not bought from ${supplier.name}.`;
    else if (pack.price === null) fields[`lines[${i}].packId`] = 'That pack has no price yet: add one in the ingredient’s packs first.';
  });
  if (Object.keys(fields).length) throw invalidInput(fields);
  const priced = lines.map((l) => {
    const pack = packs.get(l.packId)!;
    return { pack, quantity: l.quantity, unitPrice: pack.price as string, taxPct: pack.purchase_tax_pct };
  });
  const totals = orderTotals(priced, supplier.delivery_charge, currency);
  return { priced, totals };
}

async function writeLines(trx: Knex.Transaction, businessId: string, orderId: string, priced: Awaited<ReturnType<typeof priceLines>>) {
  await trx('purchase_order_lines').where({ order_id: orderId }).delete();
  if (priced.priced.length === 0) return;
  await trx('purchase_order_lines').insert(priced.priced.map((l, i) => ({
    business_id: businessId, order_id: orderId, pack_id: l.pack.id, position: i,
    description: `${l.pack.ingredient_name}: ${l.pack.description}`,
    quantity: l.quantity, unit_price: l.unitPrice, tax_pct: l.taxPct, line_total: priced.totals.lines[i].lineTotal,
  })));
}

export async function createDraft(deps: AppDeps, user: SessionUser, input: NewOrder): Promise<string> {
  return deps.db.transaction(async (trx) => {
    const site = await siteOfBusiness(trx, user.businessId, input.siteId);
    if (!site) throw invalidInput({ siteId: 'That site was not found.' });
    const supplier = await supplierTerms(trx, user.businessId, input.supplierId);
    if (!supplier) throw invalidInput({ supplierId: 'That supplier was not found.' });
    const business = await businessOf(trx, user.businessId);
    const priced = await priceLines(trx, user.businessId, supplier, input.lines, business.currency);
    const number = await nextOrderNumber(trx, user.businessId);
    const [row] = await trx('purchase_orders').insert({
      business_id: user.businessId, site_id: site.id, supplier_id: supplier.id, number, status: 'draft', currency: business.currency,
      subtotal: priced.totals.subtotal, tax: priced.totals.tax, delivery_charge: priced.totals.deliveryCharge, total: priced.totals.total,
      payment_terms: supplier.payment_terms, notes: input.notes ?? null, created_by: user.id,
    }).returning('id');
    await writeLines(trx, user.businessId, row.id, priced);
    await addEvent(trx, user.businessId, row.id, user.id, 'created', `Draft ${number} started for ${supplier.name}, delivery to ${site.name}.`);
    return row.id as string;
  });
}

export async function updateDraft(deps: AppDeps, user: SessionUser, id: string, input: EditOrder): Promise<void> {
  await deps.db.transaction(async (trx) => {
    const order = await findOrder(trx, user.businessId, id, true);
    if (!order) throw notFound('That purchase order');
    if (order.status !== 'draft') throw conflict('not_draft', `This order is ${STATUS_WORDS[order.status]}: only a draft can be changed.`);
    if (input.version !== undefined && input.version !== order.version) {
      throw conflict('stale', 'Someone else changed this order since you opened it. Reload it to see their changes.');
    }
    const update: Partial<OrderRow> = { version: order.version + 1 };
    if (input.notes !== undefined) update.notes = input.notes ?? null;
    if (input.lines) {
      const supplier = (await supplierTerms(trx, user.businessId, order.supplier_id))!;
      const priced = await priceLines(trx, user.businessId, supplier, input.lines, order.currency);
      await writeLines(trx, user.businessId, id, priced);
      Object.assign(update, { subtotal: priced.totals.subtotal, tax: priced.totals.tax, delivery_charge: priced.totals.deliveryCharge, total: priced.totals.total, payment_terms: supplier.payment_terms });
    }
    await trx('purchase_orders').where({ id }).update({ ...update, updated_at: trx.fn.now() });
    await addEvent(trx, user.businessId, id, user.id, 'edited', input.lines ? `Lines changed: ${input.lines.length} line${input.lines.length === 1 ? '' : 's'}, total ${writeMoney((update as OrderRow).total, order.currency)} ${order.currency}.` : 'Notes changed.');
  });
}

/**
 * Places a draft: fixes its expected delivery, e-mails the supplier the order with its PDF
 * and records that the e-mail went. The e-mail is sent while the order is locked, so a
 * failed send leaves the order a draft that can be placed again.
 */
export async function placeOrder(deps: AppDeps, user: SessionUser, id: string): Promise<void> {
  await deps.db.transaction(async (trx) => {
    const order = await findOrder(trx, user.businessId, id, true);
    if (!order) throw notFound('That purchase order');
    if (order.status !== 'draft') throw conflict('not_draft', `This order is already ${STATUS_WORDS[order.status]}.`);
    const lines = await orderLines(trx, id);
    if (lines.length === 0) throw conflict('empty_order', 'Add at least one line before placing the order.');
    const supplier = (await supplierTerms(trx, user.businessId, order.supplier_id))!;
    if (!supplier.order_email) throw conflict('no_order_email', `${supplier.name} has no e-mail address for orders. Add one to the supplier first.`);
    const site = (await siteOfBusiness(trx, user.businessId, order.site_id))!;
    const business = await businessOf(trx, user.businessId);
    const now = localNow();
    const expectedOn = nextDeliveryDate({ date: now.date, time: now.time, deliveryDays: supplier.delivery_days, cutoff: supplier.order_cutoff, leadDays: supplier.lead_days });
    const codes = new Map((await trx('packs').whereIn('id', lines.map((l) => l.pack_id)).select('id', 'supplier_code')).map((p) => [p.id as string, p.supplier_code as string | null]));
    const cur = order.currency;
    const pdf = await orderPdf({
      number: order.number, businessName: business.name, siteName: site.name, supplierName: supplier.name, accountNumber: supplier.account_number,
      placedOn: now.date, expectedOn, currency: cur, paymentTerms: order.payment_terms, notes: order.notes,
      lines: lines.map((l) => ({ description: l.description, supplierCode: codes.get(l.pack_id) ?? null, quantity: l.quantity, unitPrice: writeMoney(l.unit_price, cur), lineTotal: writeMoney(l.line_total, cur) })),
      subtotal: writeMoney(order.subtotal, cur), tax: writeMoney(order.tax, cur), deliveryCharge: writeMoney(order.delivery_charge, cur), total: writeMoney(order.total, cur),
    });
    const text = [
      `Hello${supplier.contact_name ? ` ${supplier.contact_name}` : ''},`, '',
      `Please find attached purchase order ${order.number} from ${business.name}, for delivery to ${site.name}${expectedOn ? ` on ${expectedOn}` : ''}.`, '',
      ...lines.map((l) => `- ${writeQuantity(l.quantity)} × ${l.description}${codes.get(l.pack_id) ? ` [${codes.get(l.pack_id)}]` : ''}`), '',
      `Total ${writeMoney(order.total, cur)} ${cur}, ${order.payment_terms === 'card' ? 'paid by card' : 'on our account'}.`,
      ...(order.notes ? ['', order.notes] : []), '', `Thank you,`, business.name,
    ].join('\n');
    let messageId: string;
    try {
      ({ messageId } = await deps.mailer.send({
        to: supplier.order_email, subject: `Purchase order ${order.number} from ${business.name}`, text,
        attachments: [{ filename: `${order.number}.pdf`, content: pdf, contentType: 'application/pdf' }],
      }));
    } catch (err) {
      deps.logger.warn({ err, orderId: id }, 'order e-mail failed');
      throw badGateway('mail_failed', 'The order e-mail could not be sent, so the order is still a draft. Try placing it again in a minute.');
    }
    await trx('purchase_orders').where({ id }).update({
      status: 'placed', placed_at: trx.fn.now(), expected_on: expectedOn, emailed_at: trx.fn.now(), emailed_to: supplier.order_email,
      email_message_id: messageId, version: order.version + 1, updated_at: trx.fn.now(),
    });
    await addEvent(trx, user.businessId, id, user.id, 'placed', `Placed${expectedOn ? `; delivery expected ${expectedOn}` : ''}.`);
    await addEvent(trx, user.businessId, id, user.id, 'emailed', `E-mailed to ${supplier.order_email} with ${order.number}.pdf attached.`, { messageId });
  });
}

/** Cancels a draft or placed order; a paid one is refunded through the provider first (owner only). */
export async function cancelOrder(deps: AppDeps, user: SessionUser, id: string): Promise<void> {
  const order = await findOrder(deps.db, user.businessId, id);
  if (!order) throw notFound('That purchase order');
  if (order.status === 'paid') {
    if (!can(user.role, 'orders.pay')) throw forbidden('Only an owner can cancel a paid order, because its payment is refunded.');
    const p = await latestPayment(deps.db, id);
    if (p?.status === 'succeeded') await refundPayment(deps, p, user.id);
  } else if (order.status !== 'draft' && order.status !== 'placed') {
    throw conflict('cannot_cancel', `This order is ${STATUS_WORDS[order.status]} and can no longer be cancelled.`);
  }
  await deps.db.transaction(async (trx) => {
    const cur = (await findOrder(trx, user.businessId, id, true))!;
    if (cur.status === 'cancelled') return;
    if (!['draft', 'placed', 'paid'].includes(cur.status)) throw conflict('cannot_cancel', `This order is ${STATUS_WORDS[cur.status]} and can no longer be cancelled.`);
    if (cur.status === 'paid') {
      const p = await latestPayment(trx, id);
      if (p?.status !== 'refunded') throw conflict('payment_changed', 'The order’s payment changed while cancelling. Reload and try again.');
    }
    const open = await latestPayment(trx, id);
    if (cur.status === 'placed' && open && ['pending', 'unknown'].includes(open.status)) {
      throw conflict('payment_unsettled', 'A payment for this order is still being confirmed. Check the payment before cancelling.');
    }
    await trx('purchase_orders').where({ id }).update({ status: 'cancelled', cancelled_at: trx.fn.now(), version: cur.version + 1, updated_at: trx.fn.now() });
    await addEvent(trx, user.businessId, id, user.id, 'cancelled', cur.status === 'paid' ? 'Cancelled after refunding the payment.' : 'Cancelled.');
  });
}

export interface PriceChange {
  lineId: string;
  packId: string;
  description: string;
  orderedPrice: string;
  invoicePrice: string;
  packPrice: string | null;
  receivedOn: string;
}

/**
 * Records a delivery: per line the packs that arrived and the invoice price; stock on hand
 * rises in the same transaction (the receipt lines are the stock movement). Returns the
 * shortages and the lines whose invoice price differs from the pack's current price.
 */
export async function receiveOrder(deps: AppDeps, user: SessionUser, id: string, input: Receive) {
  return deps.db.transaction(async (trx) => {
    const order = await findOrder(trx, user.businessId, id, true);
    if (!order) throw notFound('That purchase order');
    if (order.payment_terms === 'card' && order.status === 'placed') throw conflict('not_paid', 'This order is paid by card: pay it before receiving the delivery.');
    if (!['placed', 'paid', 'part_received'].includes(order.status)) throw conflict('cannot_receive', `This order is ${STATUS_WORDS[order.status]}: there is nothing to receive.`);
    const receivedOn = input.receivedOn ?? localNow().date;
    const closed = await trx('periods').where({ business_id: user.businessId, status: 'closed' })
      .whereRaw("month = date_trunc('month', ?::date)::date", [receivedOn]).first('id');
    if (closed) throw conflict('period_closed', `The month of ${receivedOn} is closed: reopen it or receive with a date in an open month.`);
    const lines = new Map((await orderLines(trx, id)).map((l) => [l.id, l]));
    const fields: Record<string, string> = {};
    const seen = new Set<string>();
    input.lines.forEach((l, i) => {
      if (!lines.has(l.lineId)) fields[`lines[${i}].lineId`] = 'That line is not on this order.';
      if (seen.has(l.lineId)) fields[`lines[${i}].lineId`] = 'Each line once.';
      seen.add(l.lineId);
    });
    if (Object.keys(fields).length) throw invalidInput(fields);
    const places = currencyMinorUnits(order.currency);
    const [receipt] = await trx('receipts').insert({
      business_id: user.businessId, site_id: order.site_id, order_id: id, received_on: receivedOn,
      supplier_invoice_number: input.invoiceNumber ?? null, notes: input.notes ?? null, received_by: user.id,
    }).returning('id');
    const current = new Map((await packsForOrder(trx, user.businessId, [...lines.values()].map((l) => l.pack_id), receivedOn)).map((p) => [p.id, p.price]));
    const shortages: { lineId: string; description: string; ordered: string; received: string; short: string }[] = [];
    const priceChanges: PriceChange[] = [];
    for (const l of input.lines) {
      const line = lines.get(l.lineId) as LineRow;
      const q = dec(l.quantityReceived);
      const net = q.times(dec(l.unitPrice)).toDecimalPlaces(places, D.ROUND_HALF_UP);
      const tax = net.times(dec(line.tax_pct)).div(100).toDecimalPlaces(places, D.ROUND_HALF_UP);
      if (q.gt(0)) {
        await trx('receipt_lines').insert({
          business_id: user.businessId, receipt_id: receipt.id, order_line_id: line.id, pack_id: line.pack_id,
          quantity: l.quantityReceived, unit_price: l.unitPrice, net: net.toFixed(), tax: tax.toFixed(), note: l.note ?? null,
        });
      }
      const totalReceived = dec(line.quantity_received).plus(q);
      await trx('purchase_order_lines').where({ id: line.id })
        .update({ quantity_received: totalReceived.toFixed(), note: l.note ?? line.note });
      line.quantity_received = totalReceived.toFixed();
      if (totalReceived.lt(dec(line.quantity))) {
        shortages.push({ lineId: line.id, description: line.description, ordered: writeQuantity(line.quantity), received: writeQuantity(totalReceived), short: writeQuantity(dec(line.quantity).minus(totalReceived)) });
      }
      const packPrice = current.get(line.pack_id) ?? null;
      if (q.gt(0) && (packPrice === null || !dec(packPrice).eq(dec(l.unitPrice)))) {
        priceChanges.push({
          lineId: line.id, packId: line.pack_id, description: line.description, orderedPrice: writeMoney(line.unit_price, order.currency),
          invoicePrice: writeQuantity(l.unitPrice), packPrice: packPrice === null ? null : writeQuantity(packPrice), receivedOn,
        });
      }
    }
    const complete = [...lines.values()].every((l) => dec(l.quantity_received).gte(dec(l.quantity)));
    const status = complete ? 'received' : 'part_received';
    await trx('purchase_orders').where({ id }).update({
      status, received_at: trx.fn.now(), supplier_invoice_number: input.invoiceNumber ?? order.supplier_invoice_number, version: order.version + 1, updated_at: trx.fn.now(),
    });
    const got = input.lines.filter((l) => dec(l.quantityReceived).gt(0)).length;
    const parts = [`Delivery received on ${receivedOn}: ${got} line${got === 1 ? '' : 's'}.`];
    if (shortages.length) parts.push(`Short: ${shortages.map((s) => `${s.description} (${s.short} short)`).join('; ')}.`);
    if (priceChanges.length) parts.push(`Invoice prices differ on ${priceChanges.map((c) => `${c.description} (${c.invoicePrice} on the invoice, ${c.packPrice ?? 'no price'} on file)`).join('; ')}.`);
    await addEvent(trx, user.businessId, id, user.id, status === 'received' ? 'received' : 'part_received', parts.join(' '), { receiptId: receipt.id, shortages, priceChanges });
    return { receiptId: receipt.id as string, shortages, priceChanges };
  });
}

export async function closeOrder(deps: AppDeps, user: SessionUser, id: string): Promise<void> {
  await deps.db.transaction(async (trx) => {
    const order = await findOrder(trx, user.businessId, id, true);
    if (!order) throw notFound('That purchase order');
    if (order.status !== 'received' && order.status !== 'part_received') throw conflict('cannot_close', 'Only a received order can be closed.');
    await trx('purchase_orders').where({ id }).update({ status: 'closed', closed_at: trx.fn.now(), version: order.version + 1, updated_at: trx.fn.now() });
    await addEvent(trx, user.businessId, id, user.id, 'closed', order.status === 'part_received' ? 'Closed with lines still short: nothing more is expected.' : 'Closed.');
  });
}

/**
 * Takes the invoice price of a pack from this order's latest delivery as the pack's price,
 * dated the delivery day (source "delivery"); the repricing page then shows its effect.
 */
export async function acceptInvoicePrice(deps: AppDeps, user: SessionUser, id: string, packId: string) {
  return deps.db.transaction(async (trx) => {
    const order = await findOrder(trx, user.businessId, id, true);
    if (!order) throw notFound('That purchase order');
    const line = await trx('receipt_lines as rl').join('receipts as r', 'r.id', 'rl.receipt_id')
      .where({ 'r.order_id': id, 'rl.pack_id': packId }).orderBy('r.created_at', 'desc')
      .first('rl.unit_price', 'r.received_on');
    if (!line) throw invalidInput({ packId: 'That pack has not been received on this order.' });
    const existing = await trx('pack_prices').where({ pack_id: packId, effective_from: line.received_on, source: 'delivery', price: line.unit_price }).first('id');
    if (!existing) {
      await trx('pack_prices').insert({
        business_id: user.businessId, pack_id: packId, price: line.unit_price, effective_from: line.received_on, source: 'delivery',
        note: `Invoice price on ${order.number}`, created_by: user.id,
      });
      const pack = await trx('packs').where({ id: packId }).first('description');
      await addEvent(trx, user.businessId, id, user.id, 'price_updated', `Pack price of ${pack?.description ?? 'a pack'} set to ${writeMoney(line.unit_price, order.currency)} ${order.currency} from ${line.received_on}, from the invoice.`, { packId });
    }
    return { packId, price: writeQuantity(line.unit_price), effectiveFrom: line.received_on as string, source: 'delivery' as const, repricingPath: `/repricing?packId=${packId}` };
  });
}

export async function presentOrder(deps: AppDeps, businessId: string, id: string) {
  const db = deps.db;
  const o = await findOrder(db, businessId, id);
  if (!o) throw notFound('That purchase order');
  const [supplier, site, lines, events, payment, receipts] = await Promise.all([
    supplierTerms(db, businessId, o.supplier_id), siteOfBusiness(db, businessId, o.site_id), orderLines(db, id), orderEvents(db, id),
    presentPayment(db, id), receiptsOf(db, id),
  ]);
  const prices = new Map((await packsForOrder(db, businessId, lines.map((l) => l.pack_id), localNow().date)).map((p) => [p.id, p.price]));
  const rLines = await receiptLinesOf(db, receipts.map((r) => r.id));
  const cur = o.currency;
  const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
  return {
    id: o.id,
    number: o.number,
    status: o.status,
    version: o.version,
    site: { id: site!.id, name: site!.name },
    supplier: { id: supplier!.id, name: supplier!.name, orderEmail: supplier!.order_email, paymentTerms: supplier!.payment_terms, minimumOrder: writeMoney(supplier!.minimum_order, cur) },
    currency: cur,
    paymentTerms: o.payment_terms,
    lines: lines.map((l) => ({
      id: l.id, packId: l.pack_id, description: l.description, quantity: writeQuantity(l.quantity), unitPrice: writeMoney(l.unit_price, cur),
      taxPct: writeQuantity(l.tax_pct), lineTotal: writeMoney(l.line_total, cur), quantityReceived: writeQuantity(l.quantity_received), note: l.note,
      packPrice: prices.get(l.pack_id) == null ? null : writeQuantity(prices.get(l.pack_id) as string),
    })),
    subtotal: writeMoney(o.subtotal, cur),
    tax: writeMoney(o.tax, cur),
    deliveryCharge: writeMoney(o.delivery_charge, cur),
    total: writeMoney(o.total, cur),
    minimumShortfall: minimumShortfall(o.subtotal, supplier!.minimum_order, cur),
    notes: o.notes,
    expectedOn: o.expected_on,
    placedAt: iso(o.placed_at),
    email: o.emailed_at ? { sentAt: iso(o.emailed_at), to: o.emailed_to } : null,
    paidAt: iso(o.paid_at),
    paymentReference: o.payment_reference,
    payment,
    receivedAt: iso(o.received_at),
    closedAt: iso(o.closed_at),
    cancelledAt: iso(o.cancelled_at),
    supplierInvoiceNumber: o.supplier_invoice_number,
    invoice: o.invoice_path ? { url: `/api/purchase-orders/${o.id}/invoice`, contentType: o.invoice_content_type, name: o.invoice_original_name } : null,
    receipts: receipts.map((r) => ({
      id: r.id, receivedOn: r.received_on, invoiceNumber: r.supplier_invoice_number, notes: r.notes, receivedBy: r.received_by_name,
      lines: rLines.filter((x) => x.receipt_id === r.id).map((x) => ({ orderLineId: x.order_line_id, packId: x.pack_id, quantity: writeQuantity(x.quantity), unitPrice: writeQuantity(x.unit_price), net: writeMoney(x.net, cur), note: x.note })),
    })),
    timeline: events.map((e) => ({ id: e.id, kind: e.kind, message: e.message, actor: e.actor_name, at: new Date(e.at).toISOString() })),
    createdAt: new Date(o.created_at).toISOString(),
  };
}

export async function listPresented(deps: AppDeps, businessId: string, filter: { siteId?: string; status?: string; supplierId?: string }) {
  const rows = await listOrders(deps.db, businessId, filter);
  return rows.map((r) => ({
    id: r.id, number: r.number, status: r.status, site: { id: r.site_id, name: r.site_name }, supplier: { id: r.supplier_id, name: r.supplier_name },
    total: writeMoney(r.total, r.currency), currency: r.currency, paymentTerms: r.payment_terms, expectedOn: r.expected_on,
    createdAt: new Date(r.created_at).toISOString(), placedAt: r.placed_at ? new Date(r.placed_at).toISOString() : null,
  }));
}


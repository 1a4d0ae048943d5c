// The purchase-order lifecycle against the real PostgreSQL and the real stripe SDK
// talking to the local payments fake. Money figures are worked by hand beside each check.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { intentsFor, makeOrderWorld, placedOrder, startOrdersApp, waitFor, type OrdersContext } from './helpers';

let ctx: OrdersContext;
beforeAll(async () => {
  ctx = await startOrdersApp();
});
afterAll(() => ctx.close());

describe('draft, place, pay, webhook, receive, close', () => {
  it('runs the whole journey and records every step', async () => {
    const w = await makeOrderWorld(ctx);
    const created = await w.manager.post('/api/purchase-orders', { siteId: w.siteId, supplierId: w.supplierId, lines: [{ packId: w.milk, quantity: '3' }, { packId: w.oat, quantity: '2' }] });
    expect(created.status).toBe(201);
    const o = created.body;
    expect(o.status).toBe('draft');
    expect(o.number).toMatch(/^PO-\d{5}$/);
    // 3 × 9.60 = 28.80; 2 × 18.00 = 36.00 with 20 % tax 7.20; delivery 5.00 → 28.80 + 36.00 + 7.20 + 5.00 = 77.00.
    expect(o.lines.map((l: { lineTotal: string }) => l.lineTotal)).toEqual(['28.80', '36.00']);
    expect([o.subtotal, o.tax, o.deliveryCharge, o.total, o.currency]).toEqual(['64.80', '7.20', '5.00', '77.00', 'GBP']);
    expect(o.minimumShortfall).toBeNull();
    expect(o.payment).toBeNull();

    // Editing a draft re-prices it; 4 milk = 38.40 → total 38.40 + 36.00 + 7.20 + 5.00 = 86.60.
    const edited = await w.manager.patch(`/api/purchase-orders/${o.id}`, { version: o.version, lines: [{ packId: w.milk, quantity: '4' }, { packId: w.oat, quantity: '2' }] });
    expect(edited.status).toBe(200);
    expect(edited.body.total).toBe('86.60');
    const stale = await w.manager.patch(`/api/purchase-orders/${o.id}`, { version: o.version, notes: 'late' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale');

    const placed = await w.manager.post(`/api/purchase-orders/${o.id}/place`);
    expect(placed.status).toBe(200);
    expect(placed.body.status).toBe('placed');
    expect(placed.body.email.to).toMatch(/@dairy\.test$/);
    expect(placed.body.expectedOn).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    // Tuesday or Thursday (ISO 2 or 4).
    expect([2, 4]).toContain(new Date(`${placed.body.expectedOn}T12:00:00Z`).getUTCDay());
    const mail = await ctx.mail.waitForMessage((m) => m.subject.includes(o.number));
    expect(mail.to).toEqual([placed.body.email.to]);
    expect(mail.text).toContain('4 × ');
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0].filename).toBe(`${o.number}.pdf`);
    expect(mail.attachments[0].contentType).toBe('application/pdf');
    expect(mail.attachments[0].content.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const editPlaced = await w.manager.patch(`/api/purchase-orders/${o.id}`, { notes: 'x' });
    expect(editPlaced.status).toBe(409);
    expect(editPlaced.body.error.code).toBe('not_draft');

    // A manager may not pay; the owner pays with the published good test card.
    expect((await w.manager.post(`/api/purchase-orders/${o.id}/pay`, { paymentMethodId: 'pm_card_visa' })).status).toBe(403);
    const paid = await w.owner.post(`/api/purchase-orders/${o.id}/pay`, { paymentMethodId: 'pm_card_visa' });
    expect(paid.status, JSON.stringify(paid.body)).toBe(200);
    expect(paid.body.status).toBe('paid');
    expect(paid.body.paymentReference).toMatch(/^pi_/);
    expect(paid.body.payment).toMatchObject({ status: 'succeeded', reference: paid.body.paymentReference });
    const intents = await intentsFor(ctx.stripe, o.id);
    expect(intents).toHaveLength(1);
    // 86.60 GBP is 8660 pence (GBP has 2 minor-unit digits, ISO 4217).
    expect(intents[0]).toMatchObject({ amount: 8660, currency: 'gbp', status: 'succeeded', metadata: { order_id: o.id, order_number: o.number } });
    expect((await w.owner.post(`/api/purchase-orders/${o.id}/pay`, { paymentMethodId: 'pm_card_visa' })).status).toBe(409);

    // The webhooks for that payment arrive and change nothing more.
    await ctx.fake.flushWebhooks();
    const deliveries = (await (await fetch(`${ctx.fake.url}/__fake/webhooks`)).json()) as { type: string; state: string }[];
    expect(deliveries.filter((d) => d.type === 'payment_intent.succeeded').map((d) => d.state)).toEqual(['delivered']);
    const afterHooks = (await w.bookkeeper.get(`/api/purchase-orders/${o.id}`)).body;
    expect(afterHooks.status).toBe('paid');
    expect(afterHooks.timeline.filter((e: { kind: string }) => e.kind === 'paid')).toHaveLength(1);

    // Receive: milk one pack short, oat drink invoiced at 18.50 instead of 18.00.
    const [milkLine, oatLine] = afterHooks.lines;
    const received = await w.manager.post(`/api/purchase-orders/${o.id}/receive`, {
      receivedOn: '2026-12-03', invoiceNumber: 'INV-77',
      lines: [{ lineId: milkLine.id, quantityReceived: '3', unitPrice: '9.60', note: 'one pack short' }, { lineId: oatLine.id, quantityReceived: '2', unitPrice: '18.50' }],
    });
    expect(received.status, JSON.stringify(received.body)).toBe(200);
    expect(received.body.status).toBe('part_received');
    expect(received.body.receipt.shortages).toEqual([expect.objectContaining({ lineId: milkLine.id, ordered: '4', received: '3', short: '1' })]);
    expect(received.body.receipt.priceChanges).toEqual([expect.objectContaining({ packId: w.oat, invoicePrice: '18.5', packPrice: '18', receivedOn: '2026-12-03' })]);
    // 2 × 18.50 = 37.00 net, 20 % = 7.40 tax.
    const rl = await ctx.db('receipt_lines').where({ order_line_id: oatLine.id }).first();
    expect([rl.net, rl.tax]).toEqual(['37.0000', '7.4000']);

    // Stock rose in the same transaction: no count yet, so on hand is what arrived.
    const stock = await ctx.db('stock_items').insert([{ business_id: w.biz.businessId, site_id: w.siteId, pack_id: w.milk, par_level: '6', reorder_point: '2' }]).returning('id');
    expect(stock).toHaveLength(1);
    const levels = await w.manager.get(`/api/sites/${w.siteId}/stock`);
    expect(levels.body.items.find((i: { packId: string }) => i.packId === w.milk).onHand).toBe('3');

    // Take the invoice price as the pack price, dated the delivery.
    const price = await w.manager.post(`/api/purchase-orders/${o.id}/pack-prices`, { packId: w.oat });
    expect(price.status).toBe(201);
    expect(price.body.packPrice).toMatchObject({ price: '18.5', effectiveFrom: '2026-12-03', source: 'delivery', repricingPath: `/repricing?packId=${w.oat}` });
    const rows = await ctx.db('pack_prices').where({ pack_id: w.oat, source: 'delivery' });
    expect(rows.map((r) => [r.price, r.effective_from])).toEqual([['18.5000', '2026-12-03']]);

    const closed = await w.manager.post(`/api/purchase-orders/${o.id}/close`);
    expect(closed.body.status).toBe('closed');
    expect(closed.body.timeline.map((e: { kind: string }) => e.kind)).toEqual(
      ['created', 'edited', 'placed', 'emailed', 'payment_started', 'paid', 'part_received', 'price_updated', 'closed'],
    );
    expect(closed.body.timeline.every((e: { at: string }) => !Number.isNaN(Date.parse(e.at)))).toBe(true);
  });

  it('pays nothing for an order that is not placed, or is paid on account', async () => {
    const w = await makeOrderWorld(ctx);
    const draft = await w.owner.post('/api/purchase-orders', { siteId: w.siteId, supplierId: w.supplierId, lines: [{ packId: w.milk, quantity: '1' }] });
    const r = await w.owner.post(`/api/purchase-orders/${draft.body.id}/pay`, { paymentMethodId: 'pm_card_visa' });
    expect([r.status, r.body.error.code]).toEqual([409, 'not_placed']);
    const acct = await makeOrderWorld(ctx, { terms: 'account' });
    const id = await placedOrder(acct);
    const a = await acct.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
    expect([a.status, a.body.error.code]).toEqual([409, 'paid_on_account']);
    // On account, the delivery is received straight after placing.
    const o = (await acct.manager.get(`/api/purchase-orders/${id}`)).body;
    const rec = await acct.manager.post(`/api/purchase-orders/${id}/receive`, { lines: o.lines.map((l: { id: string; quantity: string; unitPrice: string }) => ({ lineId: l.id, quantityReceived: l.quantity, unitPrice: l.unitPrice })) });
    expect(rec.body.status).toBe('received');
    expect(rec.body.receipt.priceChanges).toEqual([]);
    expect(await intentsFor(ctx.stripe, id)).toEqual([]);
  });

  it('refuses a card order being received before it is paid', async () => {
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    const o = (await w.manager.get(`/api/purchase-orders/${id}`)).body;
    const r = await w.manager.post(`/api/purchase-orders/${id}/receive`, { lines: [{ lineId: o.lines[0].id, quantityReceived: '1', unitPrice: '9.60' }] });
    expect([r.status, r.body.error.code]).toEqual([409, 'not_paid']);
  });

  it('refuses a pack from another supplier and an order without an e-mail address', async () => {
    const w = await makeOrderWorld(ctx);
    const other = await makeOrderWorld(ctx);
    const r = await w.manager.post('/api/purchase-orders', { siteId: w.siteId, supplierId: w.supplierId, lines: [{ packId: other.milk, quantity: '1' }] });
    expect(r.status).toBe(400);
    expect(Object.keys(r.body.error.fields)).toEqual(['lines[0].packId']);
    const frac = await w.manager.post('/api/purchase-orders', { siteId: w.siteId, supplierId: w.supplierId, lines: [{ packId: w.milk, quantity: '1.5' }] });
    expect(frac.body.error.fields['lines[0].quantity']).toBe('Order whole packs.');
    const noMail = await makeOrderWorld(ctx, { orderEmail: null });
    const d = await noMail.manager.post('/api/purchase-orders', { siteId: noMail.siteId, supplierId: noMail.supplierId, lines: [{ packId: noMail.milk, quantity: '1' }] });
    const p = await noMail.manager.post(`/api/purchase-orders/${d.body.id}/place`);
    expect([p.status, p.body.error.code]).toEqual([409, 'no_order_email']);
    expect((await noMail.manager.get(`/api/purchase-orders/${d.body.id}`)).body.status).toBe('draft');
  });
});

describe('declines and authentication', () => {
  it('keeps the order unpaid with the reason in plain words, then pays with a good card', async () => {
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    const declined = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa_chargeDeclined' });
    expect(declined.status).toBe(402);
    expect(declined.body.error.code).toBe('card_declined');
    expect(declined.body.error.message).toMatch(/declined by the bank/);
    const poor = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa_chargeDeclinedInsufficientFunds' });
    expect(poor.status).toBe(402);
    expect(poor.body.error.code).toBe('card_declined');
    expect(poor.body.error.message).toMatch(/not enough money/);
    const o = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
    expect(o.status).toBe('placed');
    expect(o.payment).toMatchObject({ status: 'failed', code: 'insufficient_funds', attempt: 2 });
    const ok = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
    expect(ok.body.status).toBe('paid');
    expect(ok.body.payment.attempt).toBe(3);
    const intents = await intentsFor(ctx.stripe, id);
    expect(intents.map((i) => i.status).sort()).toEqual(['requires_payment_method', 'requires_payment_method', 'succeeded']);
  });

  it('shows that the card needs the cardholder, and settles when they complete it', async () => {
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    const r = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_authenticationRequired' });
    expect(r.status).toBe(200);
    expect(r.body.status).toBe('placed');
    expect(r.body.payment.status).toBe('requires_action');
    expect(r.body.payment.message).toMatch(/cardholder/);
    expect(r.body.payment.nextActionUrl).toMatch(/^http/);
    const again = await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
    expect([again.status, again.body.error.code]).toEqual([409, 'payment_needs_action']);
    // The cardholder completes the bank's check (the fake's test route); the webhook settles the order.
    const res = await fetch(`${ctx.fake.url}/__fake/payment_intents/${r.body.payment.reference}/authenticate`, {
      method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ result: 'succeed' }),
    });
    expect(res.status).toBe(200);
    await ctx.fake.flushWebhooks();
    const o = await waitFor(async () => (await w.owner.get(`/api/purchase-orders/${id}`)).body, (b) => b.status === 'paid');
    expect(o.status).toBe('paid');
    expect(o.paymentReference).toBe(r.body.payment.reference);
    expect(await intentsFor(ctx.stripe, id)).toHaveLength(1);
  });
});

describe('cancel', () => {
  it('cancels a draft or placed order; a paid one only by the owner, refunded first', async () => {
    const w = await makeOrderWorld(ctx);
    const id = await placedOrder(w);
    await w.owner.post(`/api/purchase-orders/${id}/pay`, { paymentMethodId: 'pm_card_visa' });
    const byManager = await w.manager.post(`/api/purchase-orders/${id}/cancel`);
    expect(byManager.status).toBe(403);
    const c = await w.owner.post(`/api/purchase-orders/${id}/cancel`);
    expect(c.status).toBe(200);
    expect(c.body.status).toBe('cancelled');
    expect(c.body.payment.status).toBe('refunded');
    expect(c.body.payment.reference).toMatch(/^re_/);
    const pi = (await intentsFor(ctx.stripe, id))[0];
    const charge = await ctx.stripe.charges.retrieve(String(pi.latest_charge));
    // Refunded in full: 77.00 GBP = 7700 pence.
    expect([charge.refunded, charge.amount_refunded]).toEqual([true, 7700]);
    expect(c.body.timeline.map((e: { kind: string }) => e.kind).slice(-2)).toEqual(['refunded', 'cancelled']);
    await ctx.fake.flushWebhooks();
    const after = (await w.owner.get(`/api/purchase-orders/${id}`)).body;
    expect(after.timeline.filter((e: { kind: string }) => e.kind === 'refunded')).toHaveLength(1);

    const placed = await placedOrder(w);
    expect((await w.manager.post(`/api/purchase-orders/${placed}/cancel`)).body.status).toBe('cancelled');
    expect((await w.owner.post(`/api/purchase-orders/${placed}/pay`, { paymentMethodId: 'pm_card_visa' })).body.error.code).toBe('not_placed');
  });
});

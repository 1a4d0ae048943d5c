import { afterAll, beforeAll, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import Stripe from 'stripe';
import Decimal from 'decimal.js';
import { formatMoney } from '../../src/lib/format';
import { orderTotals, toMinorUnits } from '../../src/shared/ordering';
import { DEMO } from '../../seeds/01_tenancy';
import { MENU_IDS } from '../../seeds/02_menu';
import { serveDemo, type Served, getJson } from './harness';

// The third journey in a real browser against the seeded demo café: the owner opens the
// suggested order for the dairy at Market Street, adjusts a quantity, places it (the e-mail
// with its PDF reaches the fake mailbox), pays with the published test card through the SDK
// and the payments fake, and sees it paid; the manager receives it the next morning with one
// short line and one invoice price that differs, and stock on hand rises by what arrived.

let s: Served;
beforeAll(async () => {
  s = await serveDemo();
});
afterAll(() => s?.close());

const shot = (page: Page, name: string) => s.shot(page, `orders/${name}`);

interface StockItem { packId: string; onHand: string }
interface OrderLine { id: string; packId: string; description: string; quantity: string; unitPrice: string; taxPct: string; lineTotal: string; quantityReceived: string }
interface Order {
  id: string; number: string; status: string; currency: string; total: string; subtotal: string; tax: string; deliveryCharge: string;
  lines: OrderLine[]; email: { to: string; sentAt: string } | null; paymentReference: string | null; payment: { status: string } | null;
}

async function atPhoneWidth(page: Page, name: string) {
  await page.setViewportSize({ width: 390, height: 844 });
  await shot(page, `${name}-phone`);
  // Nothing may stick out sideways at phone width (the page itself must not scroll horizontally).
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow, `${name} overflows sideways at 390 px`).toBeLessThanOrEqual(0);
  await page.setViewportSize({ width: 1280, height: 860 });
}

test('owner orders from the dairy and pays by test card; the manager receives it short with a price change', async () => {
  const page = await s.newPage();
  const site = DEMO.siteIds.market;
  const dairy = MENU_IDS.suppliers.dairy;
  let acceptedPack: string | null = null;
  try {
    await s.signIn(page, 'owner@demo.test');
    const locale = await page.evaluate(() => navigator.language);
    const money = (v: string) => formatMoney(v, 'GBP', { locale });

    // Work at Market Street (the top bar's site switcher).
    await page.getByLabel('Site', { exact: true }).selectOption({ label: 'Market Street' });
    const before = await getJson<{ items: StockItem[] }>(page, `/api/sites/${site}/stock`);

    await page.goto(`${s.url}/stock?supplierId=${dairy}`);
    await page.getByRole('heading', { name: 'Stock and ordering at Market Street', level: 1 }).waitFor();
    const suggestedSection = page.locator('section', { has: page.getByRole('heading', { name: 'Suggested order' }) });
    await suggestedSection.getByRole('table').waitFor();
    await page.locator('table tbody tr').nth(5).waitFor();
    await shot(page, 'stock');
    await atPhoneWidth(page, 'stock');

    const suggested = await getJson<{ lines: { packId: string; description: string; quantity: string }[] }>(page, `/api/sites/${site}/suggested-order?supplierId=${dairy}`);
    // The seed's deliveries left whole milk at its reorder point: it is topped up to par.
    expect(suggested.lines.map((l) => l.packId)).toContain(MENU_IDS.packs.wholeMilk);

    await suggestedSection.getByRole('link', { name: 'Order these' }).click();
    await page.getByRole('heading', { name: /New order from Meadowgate Dairy for Market Street/ }).waitFor();
    await page.locator('tr[data-line]').nth(suggested.lines.length - 1).waitFor();
    expect(await page.locator('tr[data-line]').count()).toBe(suggested.lines.length);

    // Adjust one quantity (one more pack of milk than suggested) and add a pack with the picker.
    const milk = suggested.lines.find((l) => l.packId === MENU_IDS.packs.wholeMilk)!;
    const milkQty = new Decimal(milk.quantity).plus(1).toFixed();
    await page.getByLabel(`Packs of ${milk.description}`).fill(milkQty);
    const { packs } = await getJson<{ packs: { id: string; description: string; price: string | null; taxPct: string }[] }>(page, `/api/suppliers/${dairy}/catalogue`);
    const extra = packs.find((p) => p.price !== null && !suggested.lines.some((l) => l.packId === p.id))!;
    await page.getByLabel('Find a pack to add').fill(extra.description.split(':')[0]);
    await page.getByRole('button', { name: `Add ${extra.description}` }).click();
    await page.getByLabel(`Packs of ${extra.description}`).fill('2');
    expect(await page.locator('tr[data-line]').count()).toBe(suggested.lines.length + 1);

    // The editor's total follows: the catalogue's prices through the same arithmetic (each line
    // and its tax rounded half up, then summed, plus the untaxed delivery charge).
    const { supplier } = await getJson<{ supplier: { deliveryCharge: string } }>(page, `/api/suppliers/${dairy}/ordering`);
    const wanted = [...suggested.lines.map((l) => ({ packId: l.packId, quantity: l.packId === milk.packId ? milkQty : l.quantity })), { packId: extra.id, quantity: '2' }];
    const expected = orderTotals(wanted.map((w) => {
      const p = packs.find((x) => x.id === w.packId)!;
      return { quantity: w.quantity, unitPrice: p.price!, taxPct: p.taxPct };
    }), supplier.deliveryCharge, 'GBP');
    await expect.poll(() => page.locator('[data-total="total"]').textContent()).toBe(money(expected.total));
    await shot(page, 'editor');
    await atPhoneWidth(page, 'editor');

    await page.getByRole('button', { name: 'Save as draft' }).click();
    await page.waitForURL(/\/orders\/[0-9a-f-]{36}$/);
    const orderId = page.url().split('/').pop()!;
    let order = await getJson<Order>(page, `/api/purchase-orders/${orderId}`);
    expect(order.status).toBe('draft');
    expect(order.lines.map((l) => [l.packId, l.quantity]).sort()).toEqual(wanted.map((w) => [w.packId, w.quantity]).sort());
    // The order's total is the sum of its lines, their tax and the delivery charge.
    const sumLines = order.lines.reduce((a, l) => a.plus(l.lineTotal), new Decimal(0));
    expect(new Decimal(order.subtotal).eq(sumLines)).toBe(true);
    expect(new Decimal(order.total).eq(sumLines.plus(order.tax).plus(order.deliveryCharge))).toBe(true);
    expect(order.total).toBe(expected.total);
    await expect.poll(() => page.locator('[data-total="total"]').textContent()).toBe(money(order.total));
    await shot(page, 'detail-draft');

    // Place: e-mailed to the dairy's order address with the PDF attached.
    await page.getByRole('button', { name: 'Place and e-mail the order' }).click();
    await page.locator('[data-email-sent]').waitFor();
    const mail = await s.mail.waitForMessage((m) => m.attachments.some((a) => a.filename === `${order.number}.pdf`));
    expect(mail.to).toEqual(['orders@meadowgate-dairy.test']);
    const pdf = mail.attachments.find((a) => a.filename === `${order.number}.pdf`)!;
    expect(pdf.contentType).toBe('application/pdf');
    expect(pdf.content.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(await page.locator('[data-email-sent]').textContent()).toContain('orders@meadowgate-dairy.test');
    expect(await page.getByRole('link', { name: 'Open the development mailbox' }).getAttribute('href')).toBe(s.mail.httpUrl);
    await shot(page, 'detail-placed');

    // Pay with the published test card that succeeds.
    await page.getByRole('button', { name: 'Pay by card' }).click();
    const dialog = page.getByRole('dialog', { name: `Pay ${order.number}` });
    await dialog.getByText('Test mode — no real card is charged').waitFor();
    await dialog.getByLabel(/Test card that pays/).check();
    await shot(page, 'pay-dialog');
    await dialog.getByRole('button', { name: `Pay ${money(order.total)}` }).click();
    await page.getByText('Paid by card').first().waitFor();
    await dialog.waitFor({ state: 'hidden' });
    order = await getJson<Order>(page, `/api/purchase-orders/${orderId}`);
    expect(order.status).toBe('paid');
    expect(order.payment?.status).toBe('succeeded');
    expect(order.paymentReference).toMatch(/^pi_/);
    // One PaymentIntent at the payments fake, for the order total in pence.
    const stripe = new Stripe(s.config.STRIPE_SECRET_KEY, { host: s.payments.host, port: s.payments.port, protocol: 'http' });
    const intents = (await stripe.paymentIntents.list({ limit: 100 })).data.filter((pi) => pi.metadata.order_id === orderId);
    expect(intents.map((pi) => [pi.id, pi.status, pi.amount, pi.currency])).toEqual([[order.paymentReference, 'succeeded', toMinorUnits(order.total, 'GBP'), 'gbp']]);
    await shot(page, 'detail-paid');
    await atPhoneWidth(page, 'detail-paid');

    // The next morning: the manager receives it, one pack of milk short and the added pack invoiced 0.40 higher.
    await s.signIn(page, 'manager@demo.test');
    await page.goto(`${s.url}/orders/${orderId}`);
    await page.getByRole('link', { name: 'Receive the delivery' }).click();
    await page.getByRole('heading', { name: `Receive ${order.number} from Meadowgate Dairy` }).waitFor();
    const milkLine = order.lines.find((l) => l.packId === MENU_IDS.packs.wholeMilk)!;
    const pricedLine = order.lines.find((l) => l.packId === extra.id)!;
    const milkReceived = new Decimal(milkLine.quantity).minus(1).toFixed();
    const invoicePrice = new Decimal(pricedLine.unitPrice).plus('0.40').toFixed(2);
    await page.getByLabel(`Packs received, ${milkLine.description}`).fill(milkReceived);
    await page.getByLabel(`Note, ${milkLine.description}`).fill('One crate short on the van');
    await page.getByLabel(`Invoice price, ${pricedLine.description}`).fill(invoicePrice);
    await page.getByLabel("Supplier's invoice number").fill('MD-20931');
    await shot(page, 'receive');
    await atPhoneWidth(page, 'receive');
    await page.getByRole('button', { name: 'Receive the delivery' }).click();

    const shortages = page.locator('[data-shortages] li');
    await shortages.first().waitFor();
    expect(await shortages.count()).toBe(1);
    expect(await shortages.first().textContent()).toContain(milkLine.description);
    const changes = page.locator('[data-price-changes] li');
    expect(await changes.count()).toBe(1);
    expect(await changes.first().textContent()).toContain(money(invoicePrice));
    await changes.first().getByRole('button', { name: `Update the pack price to ${money(invoicePrice)}` }).click();
    const reprice = changes.first().getByRole('link', { name: /See what it does/ });
    await reprice.waitFor();
    acceptedPack = pricedLine.packId;
    expect(await reprice.getAttribute('href')).toBe(`/repricing?packId=${pricedLine.packId}`);
    await shot(page, 'received');

    order = await getJson<Order>(page, `/api/purchase-orders/${orderId}`);
    expect(order.status).toBe('part_received');
    expect(order.lines.find((l) => l.id === milkLine.id)!.quantityReceived).toBe(milkReceived);
    expect(order.lines.find((l) => l.id === pricedLine.id)!.quantityReceived).toBe(pricedLine.quantity);

    // Stock on hand rose by exactly what arrived.
    const after = await getJson<{ items: StockItem[] }>(page, `/api/sites/${site}/stock`);
    const onHand = (list: { items: StockItem[] }, id: string) => new Decimal(list.items.find((i) => i.packId === id)!.onHand);
    expect(onHand(after, milkLine.packId).minus(onHand(before, milkLine.packId)).toFixed()).toBe(milkReceived);
    expect(onHand(after, pricedLine.packId).minus(onHand(before, pricedLine.packId)).toFixed()).toBe(pricedLine.quantity);

    await page.goto(`${s.url}/orders/${orderId}`);
    await page.locator('[data-kind="part_received"]').waitFor();
    await shot(page, 'detail-received');
  } finally {
    // The accepted invoice price is the demo's shared data: take it back out for the other journeys.
    if (acceptedPack) await s.db('pack_prices').where({ pack_id: acceptedPack, source: 'delivery' }).delete();
    await page.close();
  }
});

test('the other order pages: suppliers, a supplier, orders list, the saved card in settings', async () => {
  const page = await s.newPage();
  try {
    await s.signIn(page, 'owner@demo.test');
    await page.goto(`${s.url}/suppliers`);
    await page.getByRole('link', { name: 'Meadowgate Dairy' }).waitFor();
    const row = page.locator('tr', { has: page.getByRole('link', { name: 'Meadowgate Dairy' }) });
    expect(await row.textContent()).toContain('orders@meadowgate-dairy.test');
    expect(await row.textContent()).toContain('By card when ordering');
    await shot(page, 'suppliers');
    await atPhoneWidth(page, 'suppliers');

    await page.getByRole('link', { name: 'Meadowgate Dairy' }).click();
    await page.getByLabel('Order e-mail').waitFor();
    expect(await page.getByLabel('Order e-mail').inputValue()).toBe('orders@meadowgate-dairy.test');
    expect(await page.getByLabel('Order cut-off').inputValue()).toBe('14:00');
    // An inline message from the shared schema, focus on the field.
    await page.getByLabel('Minimum order').fill('-5');
    await page.getByRole('button', { name: 'Save supplier' }).click();
    await page.getByText('Must be 0 or more.').waitFor();
    expect(await page.evaluate(() => document.activeElement?.getAttribute('name'))).toBe('minimumOrder');
    await shot(page, 'supplier');
    await atPhoneWidth(page, 'supplier');

    await page.goto(`${s.url}/orders`);
    await page.locator('table tbody tr').first().waitFor();
    await shot(page, 'orders');
    await atPhoneWidth(page, 'orders');

    await page.goto(`${s.url}/settings`);
    const section = page.locator('section', { has: page.getByRole('heading', { name: 'Card for supplier orders' }) });
    await section.getByText('Test mode — no real card is charged').waitFor();
    await section.getByLabel('Test card').selectOption('pm_card_visa');
    await section.getByRole('button', { name: /Save this card|Replace the card/ }).click();
    await expect.poll(() => section.locator('[data-saved-card]').textContent()).toMatch(/ending 4242/);
    await shot(page, 'settings-card');
  } finally {
    await page.close();
  }
});

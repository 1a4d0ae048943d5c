import type { Knex } from 'knex';
import { makeBusiness, suffix, type BusinessFixture } from '../../helpers/factories';
import { makeDrink, makeIngredient, makePreparation, makeSize, makeSupplier } from '../../helpers/costing-factories';

// Books rows for tests: counts, deliveries, sales and waste, each unique to the call.

export async function makeCount(db: Knex, f: BusinessFixture, siteId: string, countDate: string, lines: { packId: string; packs: string }[], status: 'open' | 'finished' = 'finished') {
  const [c] = await db('stock_counts')
    .insert({ business_id: f.businessId, site_id: siteId, count_date: countDate, status, finished_at: status === 'finished' ? db.fn.now() : null })
    .returning('id');
  if (lines.length) await db('stock_count_lines').insert(lines.map((l) => ({ business_id: f.businessId, count_id: c.id, pack_id: l.packId, packs: l.packs })));
  return c.id as string;
}

export async function makeDelivery(
  db: Knex,
  f: BusinessFixture,
  o: { siteId: string; supplierId: string; receivedOn: string; number?: string; invoice?: string; paymentReference?: string; lines: { packId: string; quantity: string; unitPrice: string; net: string; tax?: string }[] },
) {
  const [po] = await db('purchase_orders')
    .insert({
      business_id: f.businessId, site_id: o.siteId, supplier_id: o.supplierId, number: o.number ?? `T-${suffix()}`, status: 'received', currency: 'GBP', payment_terms: 'account',
      supplier_invoice_number: o.invoice ?? null, payment_reference: o.paymentReference ?? null,
    })
    .returning('id');
  const [r] = await db('receipts').insert({ business_id: f.businessId, site_id: o.siteId, order_id: po.id, received_on: o.receivedOn }).returning('id');
  await db('receipt_lines').insert(o.lines.map((l) => ({ business_id: f.businessId, receipt_id: r.id, pack_id: l.packId, quantity: l.quantity, unit_price: l.unitPrice, net: l.net, tax: l.tax ?? '0' })));
  return { orderId: po.id as string, receiptId: r.id as string };
}

export async function makeSales(db: Knex, f: BusinessFixture, siteId: string, lines: { soldOn: string; drinkSizeId: string; quantity: string; netSales: string }[]) {
  await db('sales_lines').insert(lines.map((l) => ({ business_id: f.businessId, site_id: siteId, sold_on: l.soldOn, drink_size_id: l.drinkSizeId, quantity: l.quantity, net_sales: l.netSales })));
}

/**
 * A café for October 2026 with a price rise for beans on the 16th:
 * beans (coffee) 1 kg at 20.00, then 24.00 from 2026-10-16; milk (dairy) 1 l at 1.20;
 * a syrup of 1 kg sugar (other, 2.00 a kg) and 10 ml vanilla (syrup-sauce, 5.00 per 100 ml)
 * yielding 1.25 l, used by a 10 ml pump; cups (packaging) 50 for 5.00.
 * Latte: 18 g beans, 250 ml milk, 1 pump, 1 cup.
 */
export async function makeBooksCafe(db: Knex) {
  const f = await makeBusiness(db);
  const biz = f.businessId;
  const supplierId = await makeSupplier(db, biz, `Hillside Roasters ${suffix()}`);
  const beans = await makeIngredient(db, biz, { name: `Beans ${suffix()}`, category: 'coffee', baseUnit: 'g', pack: { quantity: '1', unit: 'kg', price: '20.00', supplierId } });
  await db('pack_prices').insert({ business_id: biz, pack_id: beans.packId, price: '24.00', effective_from: '2026-10-16' });
  const milk = await makeIngredient(db, biz, { name: `Milk ${suffix()}`, category: 'dairy', baseUnit: 'ml', density: '1.03', pack: { quantity: '1', unit: 'l', price: '1.20', supplierId } });
  const sugar = await makeIngredient(db, biz, { name: `Sugar ${suffix()}`, category: 'other', baseUnit: 'g', pack: { quantity: '1', unit: 'kg', price: '2.00' } });
  const vanilla = await makeIngredient(db, biz, { name: `Vanilla ${suffix()}`, category: 'syrup-sauce', baseUnit: 'ml', pack: { quantity: '100', unit: 'ml', price: '5.00' } });
  const cups = await makeIngredient(db, biz, { name: `Cups ${suffix()}`, category: 'packaging', baseUnit: 'each', pack: { quantity: '50', unit: 'each', price: '5.00', supplierId } });
  const syrup = await makePreparation(db, biz, {
    name: `Syrup ${suffix()}`,
    yieldQuantity: '1.25',
    yieldUnit: 'l',
    lines: [
      { ingredientId: sugar.id, quantity: '1', unit: 'kg' },
      { ingredientId: vanilla.id, quantity: '10', unit: 'ml' },
    ],
    measures: [{ name: 'pump', quantity: '10', unit: 'ml' }],
  });
  const sizeId = await makeSize(db, biz, { name: `Regular ${suffix()}` });
  const latte = await makeDrink(db, biz, {
    name: `Latte ${suffix()}`,
    sizes: [{ sizeId, price: '3.40', lines: [
      { ingredientId: beans.id, quantity: '18', unit: 'g' },
      { ingredientId: milk.id, quantity: '250', unit: 'ml' },
      { preparationId: syrup.id, quantity: '1', measureId: syrup.measures.pump },
      { ingredientId: cups.id, quantity: '1', unit: 'each' },
    ] }],
  });
  return { f, biz, supplierId, beans, milk, sugar, vanilla, cups, syrup, latteSizeId: latte.drinkSizeIds[0] };
}

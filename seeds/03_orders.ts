import type { Knex } from 'knex';
import { orderTotals } from '../src/shared/ordering';
import { DEMO } from './01_tenancy';
import { MENU_IDS } from './02_menu';

// The invented café's ordering: each supplier's ordering terms, par levels and reorder
// points for every pack at both sites, and a few purchase orders in different states
// (delivered last week, which is where today's stock on hand comes from; one placed and
// waiting for payment; one draft). All figures are invented for the demo.

const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);
const at = (n: number) => new Date(Date.now() - n * 86_400_000);

const TERMS = [
  // The dairy is paid by card when ordering in this scenario, so the owner can try paying.
  { id: MENU_IDS.suppliers.dairy, minimum_order: '40', order_cutoff: '14:00', lead_days: 1, delivery_charge: '3.50', payment_terms: 'card', account_number: 'LRC-0042' },
  { id: MENU_IDS.suppliers.roaster, minimum_order: '60', order_cutoff: '12:00', lead_days: 2, delivery_charge: '0', payment_terms: 'card', account_number: 'RB-1187' },
  { id: MENU_IDS.suppliers.wholesaler, minimum_order: '100', order_cutoff: '16:00', lead_days: 1, delivery_charge: '6.00', payment_terms: 'account', account_number: 'HCS-77310' },
] as const;

interface PackRow { id: string; supplier_id: string; description: string; ingredient: string; tax: string; price: string }

async function clear(knex: Knex) {
  await knex('purchase_orders').where({ business_id: DEMO.businessId }).delete();
  await knex('stock_items').where({ business_id: DEMO.businessId }).delete();
  await knex('payment_customers').where({ business_id: DEMO.businessId }).delete();
}

/** Par and reorder point in packs: the milks turn over fastest. */
function levels(p: PackRow): { par: string; reorder: string } {
  if (p.id === MENU_IDS.packs.wholeMilk) return { par: '8', reorder: '3' };
  if (p.id === MENU_IDS.packs.oatDrink) return { par: '4', reorder: '2' };
  if (p.id === MENU_IDS.packs.espressoBeans) return { par: '6', reorder: '2' };
  return { par: '3', reorder: '1' };
}

async function insertOrder(knex: Knex, o: {
  number: string; siteId: string; supplierId: string; status: string; daysAgo: number; terms: string; deliveryCharge: string;
  lines: { pack: PackRow; quantity: string; received?: string }[]; actor: string | null;
}) {
  const totals = orderTotals(o.lines.map((l) => ({ quantity: l.quantity, unitPrice: l.pack.price, taxPct: l.pack.tax })), o.deliveryCharge, 'GBP');
  const placed = o.status !== 'draft';
  const done = o.status === 'closed' || o.status === 'received';
  const [row] = await knex('purchase_orders').insert({
    business_id: DEMO.businessId, site_id: o.siteId, supplier_id: o.supplierId, number: o.number, status: o.status, currency: 'GBP',
    subtotal: totals.subtotal, tax: totals.tax, delivery_charge: totals.deliveryCharge, total: totals.total, payment_terms: o.terms,
    expected_on: placed ? daysAgo(o.daysAgo - 1) : null, placed_at: placed ? at(o.daysAgo) : null, emailed_at: placed ? at(o.daysAgo) : null,
    received_at: done ? at(o.daysAgo - 1) : null, closed_at: o.status === 'closed' ? at(o.daysAgo - 1) : null, created_by: o.actor,
    created_at: at(o.daysAgo), updated_at: at(o.daysAgo),
  }).returning('id');
  const lineIds: string[] = [];
  for (const [i, l] of o.lines.entries()) {
    const [line] = await knex('purchase_order_lines').insert({
      business_id: DEMO.businessId, order_id: row.id, pack_id: l.pack.id, position: i, description: `${l.pack.ingredient}: ${l.pack.description}`,
      quantity: l.quantity, unit_price: l.pack.price, tax_pct: l.pack.tax, line_total: totals.lines[i].lineTotal, quantity_received: done ? (l.received ?? l.quantity) : '0',
    }).returning('id');
    lineIds.push(line.id);
  }
  const events: [string, string, number][] = [['created', `Draft ${o.number} started.`, o.daysAgo]];
  if (placed) events.push(['placed', 'Placed.', o.daysAgo], ['emailed', `E-mailed to the supplier with ${o.number}.pdf attached.`, o.daysAgo]);
  if (done) {
    const [receipt] = await knex('receipts').insert({
      business_id: DEMO.businessId, site_id: o.siteId, order_id: row.id, received_on: daysAgo(o.daysAgo - 1), received_by: o.actor, created_at: at(o.daysAgo - 1),
    }).returning('id');
    await knex('receipt_lines').insert(o.lines.map((l, i) => ({
      business_id: DEMO.businessId, receipt_id: receipt.id, order_line_id: lineIds[i], pack_id: l.pack.id, quantity: l.received ?? l.quantity, unit_price: l.pack.price,
      net: totals.lines[i].lineTotal, tax: totals.lines[i].tax,
    })));
    events.push(['received', `Delivery received on ${daysAgo(o.daysAgo - 1)}.`, o.daysAgo - 1]);
    if (o.status === 'closed') events.push(['closed', 'Closed.', o.daysAgo - 1]);
  }
  await knex('purchase_order_events').insert(events.map(([kind, message, ago], i) => ({
    business_id: DEMO.businessId, order_id: row.id, kind, message, actor_id: o.actor, at: new Date(at(ago).getTime() + i * 60_000),
  })));
}

export async function seed(knex: Knex) {
  await clear(knex);
  for (const t of TERMS) {
    const { id, ...values } = t;
    await knex('suppliers').where({ id, business_id: DEMO.businessId }).update(values);
  }
  const packs: PackRow[] = await knex('packs as p').join('ingredients as i', 'i.id', 'p.ingredient_id')
    .where('p.business_id', DEMO.businessId).whereNotNull('p.supplier_id').orderBy(['i.name', 'p.description'])
    .select('p.id', 'p.supplier_id', 'p.description', 'i.name as ingredient', 'p.purchase_tax_pct as tax',
      knex.raw('(select price from pack_prices pp where pp.pack_id = p.id order by effective_from desc, created_at desc limit 1) as price'));
  const sites = [DEMO.siteIds.market, DEMO.siteIds.canal];
  await knex('stock_items').insert(sites.flatMap((siteId) => packs.map((p) => ({
    business_id: DEMO.businessId, site_id: siteId, pack_id: p.id, par_level: levels(p).par, reorder_point: levels(p).reorder,
  }))));

  const owner = (await knex('users').where({ email: 'owner@demo.test' }).first('id'))?.id ?? null;
  const manager = (await knex('users').where({ email: 'manager@demo.test' }).first('id'))?.id ?? null;
  const of = (supplierId: string) => packs.filter((p) => p.supplier_id === supplierId);

  // Last week's deliveries are the stock on hand now (no count yet): the dairy's whole milk
  // and oat drink came in at their reorder points, so today's suggested order tops them up.
  let n = 0;
  const number = () => `PO-${String((n += 1)).padStart(5, '0')}`;
  for (const siteId of sites) {
    await insertOrder(knex, {
      number: number(), siteId, supplierId: MENU_IDS.suppliers.dairy, status: 'closed', daysAgo: 7, terms: 'card', deliveryCharge: '3.50', actor: manager,
      lines: of(MENU_IDS.suppliers.dairy).map((p) => {
        const l = levels(p);
        const q = p.id === MENU_IDS.packs.wholeMilk || p.id === MENU_IDS.packs.oatDrink ? l.reorder : l.par;
        return { pack: p, quantity: q };
      }),
    });
    await insertOrder(knex, {
      number: number(), siteId, supplierId: MENU_IDS.suppliers.wholesaler, status: 'closed', daysAgo: 6, terms: 'account', deliveryCharge: '6.00', actor: manager,
      lines: of(MENU_IDS.suppliers.wholesaler).map((p, i) => ({ pack: p, quantity: i % 4 === 0 ? levels(p).reorder : levels(p).par })),
    });
  }
  const roaster = of(MENU_IDS.suppliers.roaster);
  await insertOrder(knex, {
    number: number(), siteId: DEMO.siteIds.market, supplierId: MENU_IDS.suppliers.roaster, status: 'closed', daysAgo: 8, terms: 'card', deliveryCharge: '0', actor: owner,
    lines: roaster.map((p) => ({ pack: p, quantity: levels(p).par })),
  });
  await insertOrder(knex, {
    number: number(), siteId: DEMO.siteIds.canal, supplierId: MENU_IDS.suppliers.roaster, status: 'placed', daysAgo: 1, terms: 'card', deliveryCharge: '0', actor: owner,
    lines: roaster.slice(0, 2).map((p) => ({ pack: p, quantity: '2' })),
  });
  const wholesale = of(MENU_IDS.suppliers.wholesaler);
  await insertOrder(knex, {
    number: number(), siteId: DEMO.siteIds.canal, supplierId: MENU_IDS.suppliers.wholesaler, status: 'draft', daysAgo: 0, terms: 'account', deliveryCharge: '6.00', actor: manager,
    lines: wholesale.slice(0, 3).map((p) => ({ pack: p, quantity: '1' })),
  });
}

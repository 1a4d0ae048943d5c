import type { Knex } from 'knex';
import { addMonths, monthBounds } from '../../src/shared/books';
import { D, dec } from '../../src/shared/decimal';
import { writeMoney, writeQuantity } from '../../src/shared/money';
import { notFound } from '../platform/errors';
import { cogsReport, type CogsReport } from './cogs.service';
import { purchasesBySupplier } from './cogs.repo';
import { pages, slug, type CsvColumn, type CsvRecord } from '../platform/csv';
import { assertSite } from './sites';

/** Column names of the exports (documented in the README): plain words, our own. */
export const COGS_COLUMNS: CsvColumn[] = [
  { key: 'month', header: 'month' },
  { key: 'site', header: 'site' },
  { key: 'category', header: 'category' },
  { key: 'opening', header: 'opening_stock' },
  { key: 'purchases', header: 'purchases_net' },
  { key: 'closing', header: 'closing_stock' },
  { key: 'actual', header: 'actual_cost' },
  { key: 'theoretical', header: 'theoretical_cost' },
  { key: 'variance', header: 'variance' },
  { key: 'variancePct', header: 'variance_pct_of_theoretical' },
  { key: 'waste', header: 'waste_at_cost' },
  { key: 'netSales', header: 'net_sales' },
  { key: 'cogsPctOfSales', header: 'cost_pct_of_net_sales' },
];

export const PURCHASES_COLUMNS: CsvColumn[] = [
  { key: 'receivedOn', header: 'date_received' },
  { key: 'site', header: 'site' },
  { key: 'supplier', header: 'supplier' },
  { key: 'orderNumber', header: 'order_number' },
  { key: 'invoice', header: 'supplier_invoice_number' },
  { key: 'net', header: 'net' },
  { key: 'tax', header: 'tax' },
  { key: 'gross', header: 'gross' },
  { key: 'paymentReference', header: 'payment_reference' },
];

export const STOCK_COLUMNS: CsvColumn[] = [
  { key: 'countDate', header: 'count_date' },
  { key: 'site', header: 'site' },
  { key: 'area', header: 'storage_area' },
  { key: 'ingredient', header: 'ingredient' },
  { key: 'category', header: 'category' },
  { key: 'pack', header: 'pack' },
  { key: 'packs', header: 'packs_counted' },
  { key: 'price', header: 'pack_price' },
  { key: 'value', header: 'value' },
];

async function siteLabel(db: Knex, businessId: string, siteId: string | null): Promise<string> {
  return siteId ? (await assertSite(db, businessId, siteId)).name : 'All sites';
}

/** The cost-of-goods report as CSV records: one per category, then the totals. */
export async function cogsCsv(db: Knex, businessId: string, month: string, siteId: string | null): Promise<{ filename: string; records: CsvRecord[]; report: CogsReport }> {
  const site = await siteLabel(db, businessId, siteId);
  const report = await cogsReport(db, businessId, month, siteId);
  const records: CsvRecord[] = report.rows.map((r) => ({ month, site, ...r, netSales: null, cogsPctOfSales: null }));
  records.push({ month, site, category: 'All categories', ...report.totals });
  return { filename: `cost-of-goods_${month}_${slug(site)}.csv`, records, report };
}

interface LedgerRow {
  id: string;
  received_on: string;
  site: string;
  supplier: string;
  number: string;
  invoice: string | null;
  net: string | null;
  tax: string | null;
  payment_reference: string | null;
}

const LEDGER_PAGE = 2000;

/** The purchases ledger of a month: one record per delivery received, read page by page. */
export async function purchasesCsv(db: Knex, businessId: string, month: string, siteId: string | null) {
  const site = await siteLabel(db, businessId, siteId);
  const { first, last } = monthBounds(month);
  const currency = (await db('businesses').where({ id: businessId }).first('currency')).currency as string;
  const fetchPage = (after: LedgerRow | null) =>
    db('receipts as r')
      .join('purchase_orders as po', 'po.id', 'r.order_id')
      .join('suppliers as s', 's.id', 'po.supplier_id')
      .join('sites as st', 'st.id', 'r.site_id')
      .leftJoin('receipt_lines as rl', 'rl.receipt_id', 'r.id')
      .where('r.business_id', businessId)
      .whereBetween('r.received_on', [first, last])
      .modify((q) => {
        if (siteId) q.where('r.site_id', siteId);
        if (after) q.whereRaw('(r.received_on, r.id) > (?::date, ?::uuid)', [after.received_on, after.id]);
      })
      .groupBy('r.id', 'st.name', 's.name', 'po.number', 'po.supplier_invoice_number', 'po.payment_reference')
      .orderBy([{ column: 'r.received_on' }, { column: 'r.id' }])
      .limit(LEDGER_PAGE)
      .select(
        'r.id', 'r.received_on', 'st.name as site', 's.name as supplier', 'po.number',
        db.raw('coalesce(r.supplier_invoice_number, po.supplier_invoice_number) as invoice'),
        db.raw('sum(rl.net) as net'), db.raw('sum(rl.tax) as tax'), 'po.payment_reference',
      ) as Promise<LedgerRow[]>;
  async function* records(): AsyncGenerator<CsvRecord> {
    for await (const r of pages(fetchPage, LEDGER_PAGE)) {
      const net = dec(r.net ?? '0');
      const tax = dec(r.tax ?? '0');
      yield {
        receivedOn: r.received_on,
        site: r.site,
        supplier: r.supplier,
        orderNumber: r.number,
        invoice: r.invoice,
        net: writeMoney(net, currency),
        tax: writeMoney(tax, currency),
        gross: writeMoney(net.plus(tax), currency),
        paymentReference: r.payment_reference,
      };
    }
  }
  return { filename: `purchases_${month}_${slug(site)}.csv`, records: records() };
}

/** A count's stock valuation: each pack counted × its price in force on the count date, then the total. */
export async function stockValuationCsv(db: Knex, businessId: string, countId: string) {
  const count = await db('stock_counts as c').join('sites as s', 's.id', 'c.site_id').where({ 'c.id': countId, 'c.business_id': businessId }).first('c.id', 'c.count_date', 's.name as site');
  if (!count) throw notFound('That count');
  const currency = (await db('businesses').where({ id: businessId }).first('currency')).currency as string;
  const { rows } = await db.raw(
    `select a.name as area, i.name as ingredient, i.category, p.description as pack, l.packs, coalesce(l.frozen_price, pr.price) as price
       from stock_count_lines l
       join packs p on p.id = l.pack_id
       join ingredients i on i.id = p.ingredient_id
       left join storage_areas a on a.id = l.storage_area_id
       left join lateral (select pp.price from pack_prices pp where pp.pack_id = l.pack_id and pp.effective_from <= ?::date
                          order by pp.effective_from desc, pp.created_at desc limit 1) pr on true
      where l.count_id = ?
      order by a.position nulls last, a.name nulls last, i.name, p.description`,
    [count.count_date, countId],
  );
  let total = new D(0);
  const records: CsvRecord[] = rows.map((r: { area: string | null; ingredient: string; category: string; pack: string; packs: string; price: string | null }) => {
    const value = r.price === null ? null : dec(r.packs).times(dec(r.price));
    if (value) total = total.plus(dec(writeMoney(value, currency)));
    return {
      countDate: count.count_date,
      site: count.site,
      area: r.area ?? '',
      ingredient: r.ingredient,
      category: r.category,
      pack: r.pack,
      packs: writeQuantity(r.packs),
      price: r.price === null ? null : writeMoney(r.price, currency),
      value: value ? writeMoney(value, currency) : null,
    };
  });
  records.push({ countDate: count.count_date, site: count.site, area: '', ingredient: 'Total', category: '', pack: '', packs: null, price: null, value: writeMoney(total, currency) });
  return { filename: `stock-valuation_${count.count_date}_${slug(count.site)}.csv`, records };
}

export async function supplierChart(db: Knex, businessId: string, month: string, siteId: string | null) {
  if (siteId) await assertSite(db, businessId, siteId);
  const { first, last } = monthBounds(month);
  const currency = (await db('businesses').where({ id: businessId }).first('currency')).currency as string;
  const rows = await purchasesBySupplier(db, businessId, siteId, first, last);
  return { month, siteId, currency, suppliers: rows.map((r) => ({ supplier: r.supplier, net: writeMoney(r.net, currency) })) };
}

/** Cost of goods % of net sales for the months up to `month` (closed months from their frozen report). */
export async function cogsTrend(db: Knex, businessId: string, month: string, siteId: string | null, count: number) {
  const months = Array.from({ length: count }, (_, i) => addMonths(month, i - count + 1));
  const out = [];
  let currency = '';
  for (const m of months) {
    const r = await cogsReport(db, businessId, m, siteId);
    currency = r.currency;
    out.push({ month: m, closed: r.closed, actual: r.totals.actual, theoretical: r.totals.theoretical, netSales: r.totals.netSales, cogsPctOfSales: r.totals.cogsPctOfSales });
  }
  return { siteId, currency, months: out };
}

import type { Knex } from 'knex';
import { addMonths, monthBounds } from '../../src/shared/books';
import type { CogsReport, TrendMonth } from '../../src/shared/contract/books';
import { D, dec } from '../../src/shared/decimal';
import { writeMoney, writeQuantity } from '../../src/shared/money';
import { invalidInput } from '../platform/errors';
import { cogsReport } from './cogs.service';
import { purchasesBySupplier } from './cogs.repo';
import { currencyOf } from './books.repo';
import { pages, slug, type CsvColumn, type CsvRecord } from '../platform/csv';
import { ledgerPage, LEDGER_PAGE, valuationLines, valuedCount, type LedgerRow } from './reports.repo';
import { siteFromInput } from './sites';

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
  return siteId ? (await siteFromInput(db, businessId, siteId)).name : 'All sites';
}

/** The cost-of-goods report as CSV records: one per category, then the totals. */
export async function cogsCsv(db: Knex, businessId: string, month: string, siteId: string | null): Promise<{ filename: string; records: CsvRecord[]; report: CogsReport }> {
  const site = await siteLabel(db, businessId, siteId);
  const report = await cogsReport(db, businessId, month, siteId);
  const records: CsvRecord[] = report.rows.map((r) => ({ month, site, ...r, netSales: null, cogsPctOfSales: null }));
  records.push({ month, site, category: 'All categories', ...report.totals });
  return { filename: `cost-of-goods_${month}_${slug(site)}.csv`, records, report };
}

/** The purchases ledger of a month: one record per delivery received, read page by page. */
export async function purchasesCsv(db: Knex, businessId: string, month: string, siteId: string | null) {
  const site = await siteLabel(db, businessId, siteId);
  const { first, last } = monthBounds(month);
  const currency = await currencyOf(db, businessId);
  const fetchPage = (after: LedgerRow | null) => ledgerPage(db, businessId, siteId, first, last, after);
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
  const count = await valuedCount(db, businessId, countId);
  if (!count) throw invalidInput({ countId: 'Choose one of your counts.' });
  const currency = await currencyOf(db, businessId);
  const rows = await valuationLines(db, countId, count.count_date);
  let total = new D(0);
  const records: CsvRecord[] = rows.map((r) => {
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
  if (siteId) await siteFromInput(db, businessId, siteId);
  const { first, last } = monthBounds(month);
  const currency = await currencyOf(db, businessId);
  const rows = await purchasesBySupplier(db, businessId, siteId, first, last);
  return { month, siteId, currency, suppliers: rows.map((r) => ({ supplier: r.supplier, net: writeMoney(r.net, currency) })) };
}

/** Cost of goods % of net sales for the months up to `month` (closed months from their frozen report). */
export async function cogsTrend(db: Knex, businessId: string, month: string, siteId: string | null, count: number) {
  const months = Array.from({ length: count }, (_, i) => addMonths(month, i - count + 1));
  const out: TrendMonth[] = [];
  let currency = '';
  for (const m of months) {
    const r = await cogsReport(db, businessId, m, siteId);
    currency = r.currency;
    out.push({ month: m, closed: r.closed, actual: r.totals.actual, theoretical: r.totals.theoretical, netSales: r.totals.netSales, cogsPctOfSales: r.totals.cogsPctOfSales });
  }
  return { siteId, currency, months: out };
}

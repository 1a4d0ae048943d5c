import type { Knex } from 'knex';
import { performance } from 'node:perf_hooks';
import { monthBounds } from '../../src/shared/books';

/**
 * Bench data for the books: a year of till sales for three sites of the bench business
 * (about 1,000 lines a day each, one INSERT … SELECT FROM generate_series per site), the
 * accepted monthly till imports they belong to, month-end counts, a few deliveries received
 * each month, and a few waste entries in the month the bench reports on. Deterministic (no
 * randomness) so runs compare. Invented bench data, not a computed result.
 */

export const BENCH_YEAR = 2026;
export const LINES_PER_DAY = 1000;

export interface BooksSeed {
  siteIds: string[];
  salesLines: number;
  imports: number;
  counts: number;
  receipts: number;
  waste: number;
  seconds: number;
}

const months = Array.from({ length: 12 }, (_, i) => `${BENCH_YEAR}-${String(i + 1).padStart(2, '0')}`);

export async function seedBooks(db: Knex, businessId: string, reportMonth: string): Promise<BooksSeed> {
  const t0 = performance.now();
  // The bench business's own site plus two more.
  const existing = await db('sites').where({ business_id: businessId }).orderBy('created_at').select('id');
  const added = await db('sites').insert([{ business_id: businessId, name: 'Bench Riverside' }, { business_id: businessId, name: 'Bench Station' }]).returning('id');
  const siteIds = [...existing.slice(0, 1), ...added].map((s) => s.id as string);

  // One accepted till import per site and month (the lines reference them, as an accepted upload's do).
  const imports = await db('sales_imports')
    .insert(siteIds.flatMap((siteId, s) => months.map((m) => {
      const { first, last } = monthBounds(m);
      return { business_id: businessId, site_id: siteId, file_sha256: `${String(s).padStart(2, '0')}${m.replace('-', '')}`.padEnd(64, '0'), filename: `till-${s}-${m}.csv`, status: 'accepted', first_day: first, last_day: last, accepted_at: db.fn.now() };
    })))
    .returning(['id', 'site_id', 'first_day']);

  // A year of till lines per site in one statement each: day d, line n picks a drink size
  // by a fixed stride through the menu; 1–3 cups; net of 20 % tax from the menu price.
  let salesLines = 0;
  for (const [s, siteId] of siteIds.entries()) {
    const { rowCount } = await db.raw(
      `with sizes as (
         select array_agg(id order by id) as ids, array_agg(price order by id) as prices, count(*)::int as cnt
           from drink_sizes where business_id = :biz
       ), lines as (
         select d::date as sold_on, n, sizes.ids[1 + ((extract(doy from d)::bigint * :per + n) * 7919 + :salt) % sizes.cnt] as drink_size_id,
                sizes.prices[1 + ((extract(doy from d)::bigint * :per + n) * 7919 + :salt) % sizes.cnt] as price,
                (1 + (n % 3))::numeric as quantity
           from sizes, generate_series(:first::date, :last::date, interval '1 day') d, generate_series(1, :per) as g(n)
       )
       insert into sales_lines (business_id, site_id, import_id, sold_on, drink_size_id, quantity, net_sales, tax)
       select :biz::uuid, :site::uuid, i.id, l.sold_on, l.drink_size_id, l.quantity,
              round(l.quantity * l.price / 1.2, 2), l.quantity * l.price - round(l.quantity * l.price / 1.2, 2)
         from lines l
         join sales_imports i on i.business_id = :biz and i.site_id = :site and i.first_day = date_trunc('month', l.sold_on)::date`,
      { biz: businessId, site: siteId, per: LINES_PER_DAY, salt: s * 101, first: `${BENCH_YEAR}-01-01`, last: `${BENCH_YEAR}-12-31` },
    );
    salesLines += rowCount as number;
  }
  await db.raw(`update sales_imports i set row_count = (select count(*) from sales_lines l where l.import_id = i.id) where i.business_id = ?`, [businessId]);
  void imports;

  // Finished counts at every month end (and the one before the year), every pack counted.
  const packs = await db('packs').where({ business_id: businessId }).orderBy('description').select('id', 'ingredient_id');
  const countDays = [`${BENCH_YEAR - 1}-12-31`, ...months.map((m) => monthBounds(m).last)];
  const counts = await db('stock_counts')
    .insert(siteIds.flatMap((siteId) => countDays.map((d) => ({ business_id: businessId, site_id: siteId, count_date: d, status: 'finished', finished_at: db.fn.now() }))))
    .returning(['id']);
  const countLines = counts.flatMap((c, ci) => packs.map((p, pi) => ({ business_id: businessId, count_id: c.id, pack_id: p.id, packs: String(((ci * 7 + pi * 3) % 9) + ((pi % 4) * 0.25)) })));
  for (let i = 0; i < countLines.length; i += 2000) await db('stock_count_lines').insert(countLines.slice(i, i + 2000));

  // Four deliveries received per site and month, five packs each, at the pack price of the day.
  const supplier = await db('suppliers').where({ business_id: businessId }).first('id');
  const orders = await db('purchase_orders')
    .insert(siteIds.flatMap((siteId, s) => months.flatMap((m, mi) => [0, 1, 2, 3].map((k) => ({
      business_id: businessId, site_id: siteId, supplier_id: supplier.id, number: `BENCH-${s}-${m}-${k}`, status: 'received', currency: 'GBP',
      payment_terms: 'account', supplier_invoice_number: `INV-${s}${mi}${k}`, received_at: `${m}-${String(3 + k * 7).padStart(2, '0')}T10:00:00Z`,
    })))))
    .returning(['id', 'site_id', 'received_at']);
  const receipts = await db('receipts')
    .insert(orders.map((o) => ({ business_id: businessId, site_id: o.site_id, order_id: o.id, received_on: new Date(o.received_at).toISOString().slice(0, 10) })))
    .returning(['id', 'order_id']);
  const { rows: priced } = await db.raw(
    `select distinct on (pp.pack_id) pp.pack_id, pp.price from pack_prices pp where pp.business_id = ? order by pp.pack_id, pp.effective_from`,
    [businessId],
  );
  const priceOf = new Map<string, string>(priced.map((r: { pack_id: string; price: string }) => [r.pack_id, r.price]));
  const receiptLines = receipts.flatMap((r, ri) => [0, 1, 2, 3, 4].map((k) => {
    const pack = packs[(ri * 5 + k) % packs.length];
    const qty = 2 + ((ri + k) % 5);
    return { business_id: businessId, receipt_id: r.id, pack_id: pack.id, quantity: String(qty), unit_price: priceOf.get(pack.id) ?? '1' };
  }));
  // net = quantity × unit price, worked out by PostgreSQL (numeric), not JS floats.
  await db.raw(
    `insert into receipt_lines (business_id, receipt_id, pack_id, quantity, unit_price, net, tax)
     select x.business_id, x.receipt_id, x.pack_id, x.quantity, x.unit_price, x.quantity * x.unit_price, 0
       from jsonb_to_recordset(?::jsonb) as x(business_id uuid, receipt_id uuid, pack_id uuid, quantity numeric, unit_price numeric)`,
    [JSON.stringify(receiptLines)],
  );

  // Five packs cost 6 % more from the 15th of the reported month and go back on the 1st of the
  // next, so that month is costed over two price ranges (and later months are as before).
  const back = new Date(Date.UTC(Number(reportMonth.slice(0, 4)), Number(reportMonth.slice(5, 7)), 1)).toISOString().slice(0, 10);
  const changed = packs.slice(0, 5).map((p) => p.id);
  await db.raw(
    `insert into pack_prices (business_id, pack_id, price, effective_from, source)
     select business_id, pack_id, round(price * 1.06, 2), :mid::date, 'manual' from pack_prices where pack_id = any(:ids::uuid[]) and effective_from = :start::date
     union all
     select business_id, pack_id, price, :back::date, 'manual' from pack_prices where pack_id = any(:ids::uuid[]) and effective_from = :start::date`,
    { mid: `${reportMonth}-15`, back, ids: changed, start: `${BENCH_YEAR}-01-01` },
  );

  // A few waste entries in the reported month: an ingredient, a preparation, a drink.
  const { first } = monthBounds(reportMonth);
  const prep = await db('preparations').where({ business_id: businessId }).orderBy('name').first('id');
  const size = await db('drink_sizes').where({ business_id: businessId }).orderBy('id').first('id');
  const ingredient = await db('ingredients').where({ business_id: businessId, base_unit: 'ml' }).orderBy('name').first('id');
  const waste = siteIds.flatMap((siteId) => [
    { business_id: businessId, site_id: siteId, occurred_on: first, ingredient_id: ingredient.id, quantity: '500', unit: 'ml', reason: 'Milk past its date' },
    { business_id: businessId, site_id: siteId, occurred_on: first, preparation_id: prep.id, quantity: '250', unit: 'ml', reason: 'Batch spoiled' },
    { business_id: businessId, site_id: siteId, occurred_on: first, drink_size_id: size.id, quantity: '2', unit: null, reason: 'Remade drink' },
  ]);
  await db('waste_entries').insert(waste);

  await db.raw('analyze');
  return { siteIds, salesLines, imports: imports.length, counts: counts.length, receipts: receipts.length, waste: waste.length, seconds: (performance.now() - t0) / 1000 };
}

/**
 * The bare aggregate of the month's till lines at one site (or all): cups and net sales summed
 * per drink size, the least any report of the month's sales must read.
 */
export async function bareAggregate(db: Knex, businessId: string, month: string, siteId: string | null) {
  const { first, last } = monthBounds(month);
  const { rows } = await db.raw(
    `select drink_size_id, sum(quantity) as q, sum(net_sales) as n
       from sales_lines
      where business_id = :biz and sold_on between :first and :last ${siteId ? 'and site_id = :site' : ''}
      group by drink_size_id`,
    { biz: businessId, first, last, site: siteId },
  );
  return rows as { q: string; n: string }[];
}

export interface MemoryProfile {
  ms: number;
  bytes: number;
  baselineMb: number;
  peakMb: number;
}

/** Runs `fn` while sampling the process's resident set every 10 ms: peak − the resident set just before. */
export async function sampleMemory(fn: () => Promise<number>): Promise<MemoryProfile> {
  const baseline = process.memoryUsage().rss;
  let peak = baseline;
  const timer = setInterval(() => { peak = Math.max(peak, process.memoryUsage().rss); }, 10);
  const t = performance.now();
  try {
    const bytes = await fn();
    const elapsed = performance.now() - t;
    peak = Math.max(peak, process.memoryUsage().rss);
    return { ms: elapsed, bytes, baselineMb: baseline / 2 ** 20, peakMb: peak / 2 ** 20 };
  } finally {
    clearInterval(timer);
  }
}

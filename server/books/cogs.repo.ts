import type { Knex } from 'knex';
import { INGREDIENT_CATEGORIES } from '../../src/shared/categories';

export interface ReportStateRow {
  currency: string;
  version: string | number | null;
  books_version: string | number | null;
  fingerprint: string | null;
  period_id: string | null;
  period_status: 'open' | 'closed' | null;
  site_found: boolean;
}

/** What a report needs to know before its figures, in ONE statement: versions, the month's state, whether the site is the business's. */
export async function reportStateRow(db: Knex, businessId: string, month: string, siteId: string | null): Promise<ReportStateRow> {
  const { rows } = await db.raw(
    `select b.currency,
            (select version from data_versions where business_id = b.id and kind = 'costing') as version,
            (select version from data_versions where business_id = b.id and kind = 'books') as books_version,
            (select fingerprint from recipe_cost_months where business_id = b.id and month = :month) as fingerprint,
            p.id as period_id, p.status as period_status,
            (:site::uuid is null or exists (select 1 from sites s where s.id = :site::uuid and s.business_id = b.id)) as site_found
       from businesses b left join periods p on p.business_id = b.id and p.month = :month
      where b.id = :biz`,
    { biz: businessId, month: `${month}-01`, site: siteId },
  );
  if (!rows[0]) throw new Error(`Business ${businessId} not found`);
  return rows[0];
}

// Plain rows for the month's cost of goods. Each figure is one aggregate statement in
// PostgreSQL; nothing here loops over sales lines in JavaScript.

export interface ChosenCount {
  id: string;
  site_id: string;
  count_date: string;
}

/**
 * Per site, the finished count that serves as stock on a day: the latest finished count dated
 * on or before `onOrBefore` (and, with `exactly`, dated that very day); the last finished wins a tie.
 */
export async function chooseCounts(db: Knex, businessId: string, siteId: string | null, onOrBefore: string, exactly = false): Promise<ChosenCount[]> {
  return chosenCountsQuery(db, businessId, siteId, onOrBefore, exactly);
}

/** The query of {@link chooseCounts}, to be run or used as a subquery. */
export function chosenCountsQuery(db: Knex, businessId: string, siteId: string | null, onOrBefore: string, exactly = false) {
  const q = db('stock_counts')
    .distinctOn('site_id')
    .where({ business_id: businessId, status: 'finished' })
    .orderBy([{ column: 'site_id' }, { column: 'count_date', order: 'desc' }, { column: 'finished_at', order: 'desc' }])
    .select('id', 'site_id', 'count_date');
  if (exactly) q.where('count_date', onOrBefore);
  else q.where('count_date', '<=', onOrBefore);
  if (siteId) q.where('site_id', siteId);
  return q;
}

export interface CategoryValue {
  category: string;
  value: string;
  unpriced: string;
}

/**
 * Stock value of counts by ingredient category: packs × the pack price in force on the count
 * date (or the price frozen at close). The counts are given by id, or as the query that chooses
 * them ({@link chosenCountsQuery}), so choosing and valuing them is one statement.
 */
export async function countValueByCategory(db: Knex, counts: string[] | Knex.QueryBuilder): Promise<CategoryValue[]> {
  if (Array.isArray(counts) && !counts.length) return [];
  const which = Array.isArray(counts) ? 'l.count_id = any(?::uuid[])' : 'l.count_id in (select chosen.id from (?) as chosen)';
  const { rows } = await db.raw(
    `select i.category, sum(l.packs * coalesce(l.frozen_price, pr.price, 0)) as value,
            count(*) filter (where l.frozen_price is null and pr.price is null and l.packs > 0) as unpriced
       from stock_count_lines l
       join stock_counts c on c.id = l.count_id
       join packs p on p.id = l.pack_id
       join ingredients i on i.id = p.ingredient_id
       left join lateral (
         select pp.price from pack_prices pp
          where pp.pack_id = l.pack_id and pp.effective_from <= c.count_date
          order by pp.effective_from desc, pp.created_at desc limit 1) pr on true
      where ${which}
      group by i.category`,
    [counts],
  );
  return rows;
}

/** Receipt lines of deliveries received in the days (at one site or all). */
function receivedLines(db: Knex, businessId: string, siteId: string | null, first: string, last: string) {
  return db('receipt_lines as rl')
    .join('receipts as r', 'r.id', 'rl.receipt_id')
    .where('r.business_id', businessId)
    .whereBetween('r.received_on', [first, last])
    .modify((q) => (siteId ? q.where('r.site_id', siteId) : q));
}

/** Purchases received in the days, net of purchase tax, by the category of each pack's ingredient. */
export async function purchasesByCategory(db: Knex, businessId: string, siteId: string | null, first: string, last: string): Promise<{ category: string; net: string }[]> {
  return receivedLines(db, businessId, siteId, first, last)
    .join('packs as p', 'p.id', 'rl.pack_id')
    .join('ingredients as i', 'i.id', 'p.ingredient_id')
    .groupBy('i.category')
    .select('i.category', db.raw('sum(rl.net) as net'));
}

/** Purchases received in the days by supplier (net of purchase tax). */
export async function purchasesBySupplier(db: Knex, businessId: string, siteId: string | null, first: string, last: string): Promise<{ supplier: string; net: string }[]> {
  return receivedLines(db, businessId, siteId, first, last)
    .join('purchase_orders as po', 'po.id', 'r.order_id')
    .join('suppliers as s', 's.id', 'po.supplier_id')
    .groupBy('s.name')
    .orderBy('net', 'desc')
    .select('s.name as supplier', db.raw('sum(rl.net) as net'));
}

export interface SalesAggregate {
  theoretical: { category: string; cost: string }[];
  netSales: string;
  cups: string;
  uncostedCups: string;
}

/**
 * Theoretical cost by category and the month's net sales in ONE statement. The month is split
 * into the price ranges recipe_costs was built over (`rangeStarts`: the 1st, then each day a
 * pack price takes effect, ascending); the sales are summed per drink size and range, then
 * joined to the recipe cost of that size in that range. Cups of a size with no recipe cost in
 * their range (no build, an unpriced ingredient) are counted as uncosted.
 */
export async function salesAggregate(db: Knex, businessId: string, siteId: string | null, month: string, first: string, last: string, rangeStarts: readonly string[]): Promise<SalesAggregate> {
  const site = siteId ? 'and site_id = :site' : '';
  // Summed per drink size only (a hash aggregate over the month's lines, as a plain SUM … GROUP
  // BY would be), with one filtered sum of cups per price range, then unfolded into one row per
  // size and range. Range i holds the days from start i to the day before start i + 1.
  const bindings: Record<string, string | null> = { biz: businessId, site: siteId, month: `${month}-01`, first, last };
  rangeStarts.forEach((d, i) => { bindings[`start${i}`] = d; });
  const inRange = (i: number) => (i + 1 < rangeStarts.length ? `filter (where sold_on < :start${i + 1}::date${i > 0 ? ` and sold_on >= :start${i}::date` : ''})` : i > 0 ? `filter (where sold_on >= :start${i}::date)` : '');
  const rangeSums = rangeStarts.map((_, i) => `, sum(quantity) ${inRange(i)} as q${i}`).join('');
  if (!rangeStarts.length || rangeStarts[0] !== first) throw new RangeError('The price ranges of a month start on its first day.');
  const unfold = rangeStarts.map((_, i) => `(:start${i}::date, q${i})`).join(', ');
  // One left join of the size × range sums to the recipe costs (at most one row per size and
  // range: the primary key), summing each category's element; cups are the sum over every size
  // and range, and those with no recipe cost in their range are uncosted.
  const categorySums = INGREDIENT_CATEGORIES.map((_, i) => `sum(s.q * rc.costs[${i + 1}]) as c${i}`).join(', ');
  const { rows } = await db.raw(
    `with by_size as (
       select drink_size_id, sum(net_sales) as net${rangeSums}
         from sales_lines
        where business_id = :biz and sold_on between :first and :last ${site}
        group by drink_size_id
     ), s as (
       select b.drink_size_id, r.range_start, r.q from by_size b cross join lateral (values ${unfold}) as r(range_start, q) where r.q is not null
     )
     select ${categorySums}, coalesce(sum(s.q) filter (where rc.drink_size_id is null), 0) as uncosted,
            (select coalesce(sum(net), 0) from by_size) as net, coalesce(sum(s.q), 0) as cups
       from s left join recipe_costs rc on rc.business_id = :biz and rc.month = :month and rc.drink_size_id = s.drink_size_id and rc.valid_from = s.range_start`,
    bindings,
  );
  const r = rows[0] as Record<string, string | null>;
  return {
    // A category no costed build uses has no sum (null) and no row.
    theoretical: INGREDIENT_CATEGORIES.flatMap((category, i) => (r[`c${i}`] === null ? [] : [{ category, cost: r[`c${i}`] as string }])),
    netSales: r.net ?? '0',
    cups: r.cups ?? '0',
    uncostedCups: r.uncosted ?? '0',
  };
}

export interface WasteRow {
  id: string;
  site_id: string;
  occurred_on: string;
  ingredient_id: string | null;
  preparation_id: string | null;
  drink_size_id: string | null;
  quantity: string;
  unit: string | null;
  reason: string;
}

export async function wasteInRange(db: Knex, businessId: string, siteId: string | null, first: string, last: string): Promise<WasteRow[]> {
  const q = db('waste_entries')
    .where({ business_id: businessId })
    .whereBetween('occurred_on', [first, last])
    .orderBy([{ column: 'occurred_on' }, { column: 'created_at' }])
    .select('id', 'site_id', 'occurred_on', 'ingredient_id', 'preparation_id', 'drink_size_id', 'quantity', 'unit', 'reason');
  if (siteId) q.where({ site_id: siteId });
  return q;
}

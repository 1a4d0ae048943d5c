import type { Knex } from 'knex';

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

/** Stock value of counts by ingredient category: packs × the pack price in force on the count date (or the price frozen at close). */
export async function countValueByCategory(db: Knex, countIds: string[]): Promise<CategoryValue[]> {
  if (!countIds.length) return [];
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
      where l.count_id = any(?::uuid[])
      group by i.category`,
    [countIds],
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
 * Theoretical cost by category and the month's net sales in ONE statement: the sales are
 * summed per drink size and day, then joined to the recipe cost in force on that day.
 */
export async function salesAggregate(db: Knex, businessId: string, siteId: string | null, month: string, first: string, last: string): Promise<SalesAggregate> {
  const site = siteId ? 'and site_id = :site' : '';
  const { rows } = await db.raw(
    `with s as (
       select drink_size_id, sold_on, sum(quantity) as q, sum(net_sales) as n
         from sales_lines
        where business_id = :biz and sold_on between :first and :last ${site}
        group by drink_size_id, sold_on
     ), rc as (
       select drink_size_id, category, valid_from, valid_to, cost from recipe_costs where business_id = :biz and month = :month
     )
     select rc.category, sum(s.q * rc.cost) as cost, null::numeric as net, null::numeric as cups, null::numeric as uncosted
       from s join rc on rc.drink_size_id = s.drink_size_id and s.sold_on between rc.valid_from and rc.valid_to
      group by rc.category
     union all
     select null, null, coalesce(sum(s.n), 0), coalesce(sum(s.q), 0),
            coalesce(sum(s.q) filter (where not exists (
              select 1 from rc where rc.drink_size_id = s.drink_size_id and s.sold_on between rc.valid_from and rc.valid_to)), 0)
       from s`,
    { biz: businessId, site: siteId, month: `${month}-01`, first, last },
  );
  const totals = rows.find((r: { category: string | null }) => r.category === null);
  return {
    theoretical: rows.filter((r: { category: string | null }) => r.category !== null).map((r: { category: string; cost: string }) => ({ category: r.category, cost: r.cost })),
    netSales: totals?.net ?? '0',
    cups: totals?.cups ?? '0',
    uncostedCups: totals?.uncosted ?? '0',
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

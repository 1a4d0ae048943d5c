import type { Knex } from 'knex';

// Plain rows for the bookkeeper's exports: the purchases ledger and a count's valuation.

export interface LedgerRow {
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

export const LEDGER_PAGE = 2000;

/** One page of the purchases ledger (one row per delivery received), in (day, id) order after `after`. */
export function ledgerPage(db: Knex, businessId: string, siteId: string | null, first: string, last: string, after: LedgerRow | null): Promise<LedgerRow[]> {
  return db('receipts as r')
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
}

export async function valuedCount(db: Knex, businessId: string, countId: string): Promise<{ id: string; count_date: string; site: string } | undefined> {
  return db('stock_counts as c').join('sites as s', 's.id', 'c.site_id').where({ 'c.id': countId, 'c.business_id': businessId }).first('c.id', 'c.count_date', 's.name as site');
}

export interface ValuationLine {
  area: string | null;
  ingredient: string;
  category: string;
  pack: string;
  packs: string;
  price: string | null;
}

/** Each pack counted with the price it is valued at (in force on the count date, or frozen at close). */
export async function valuationLines(db: Knex, countId: string, countDate: string): Promise<ValuationLine[]> {
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
    [countDate, countId],
  );
  return rows;
}

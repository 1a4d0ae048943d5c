import type { Knex } from 'knex';
import { dec } from '../../src/shared/decimal';
import type { PriceHistoryRow } from './repricing.repo';

/*
 * Menu prices with an effective date (migration menu_price_schedule).
 *
 * A price applied with an effective date after today is a 'planned' row of menu_price_history;
 * drink_sizes.price keeps the price in force now. Reads never need a background job: the price in
 * force on a date is the latest planned entry dated on or before it, else drink_sizes.price (the
 * lateral join in loadMenuRows). Writes that change drink_sizes.price first fold the planned
 * entries that have come due into it (foldDuePrices), so that "the latest change wins" holds:
 * without the fold, a due-but-unfolded plan would still win over a price typed after its date.
 */

/** Rows of drink_sizes, locked FOR UPDATE by the caller, whose `price` is updated in place. */
export interface PricedRow {
  id: string;
  price: string | null;
}

/**
 * Folds the planned prices dated `on` or before (default today) into drink_sizes.price for the
 * given (already locked) rows: each entry becomes 'applied', its old price the one it replaced.
 * The version is NOT bumped: every read already showed these prices since their date.
 */
export async function foldDuePrices(trx: Knex, businessId: string, rows: PricedRow[], on: string = new Date().toISOString().slice(0, 10)) {
  if (rows.length === 0) return;
  const due: { id: string; drink_size_id: string; new_price: string }[] = await trx('menu_price_history')
    .where({ business_id: businessId, status: 'planned' })
    .whereIn('drink_size_id', rows.map((r) => r.id))
    .where('effective_from', '<=', on)
    .orderBy([{ column: 'drink_size_id' }, { column: 'effective_from' }, { column: 'changed_at' }])
    .select('id', 'drink_size_id', 'new_price');
  if (due.length === 0) return;
  const byId = new Map(rows.map((r) => [r.id, r]));
  const touched = new Set<PricedRow>();
  for (const d of due) {
    const row = byId.get(d.drink_size_id) as PricedRow;
    await trx('menu_price_history').where({ id: d.id }).update({ status: 'applied', applied_at: trx.fn.now(), old_price: row.price });
    row.price = d.new_price;
    touched.add(row);
  }
  for (const row of touched) await trx('drink_sizes').where({ id: row.id }).update({ price: row.price, updated_at: trx.fn.now() });
}

/** The price each drink size will carry just before `date`: the latest planned entry dated before it, else its current price. */
export async function pricesBefore(trx: Knex.Transaction, rows: PricedRow[], date: string): Promise<Map<string, string | null>> {
  const planned: { drink_size_id: string; new_price: string }[] = rows.length
    ? await trx('menu_price_history')
        .distinctOn('drink_size_id')
        .where({ status: 'planned' })
        .whereIn('drink_size_id', rows.map((r) => r.id))
        .where('effective_from', '<', date)
        .orderBy([{ column: 'drink_size_id' }, { column: 'effective_from', order: 'desc' }, { column: 'changed_at', order: 'desc' }])
        .select('drink_size_id', 'new_price')
    : [];
  const byId = new Map(planned.map((p) => [p.drink_size_id, p.new_price]));
  return new Map(rows.map((r) => [r.id, byId.get(r.id) ?? r.price]));
}

/** Cancels the planned entries of these drink sizes dated exactly `date` (a new apply for that date replaces them); returns the drink size ids touched. */
export async function supersedePlanned(trx: Knex.Transaction, businessId: string, drinkSizeIds: string[], date: string, userId: string): Promise<Set<string>> {
  if (drinkSizeIds.length === 0) return new Set();
  const rows: { drink_size_id: string }[] = await trx('menu_price_history')
    .where({ business_id: businessId, status: 'planned', effective_from: date })
    .whereIn('drink_size_id', drinkSizeIds)
    .update({ status: 'cancelled', cancelled_at: trx.fn.now(), cancelled_by: userId })
    .returning('drink_size_id');
  return new Set(rows.map((r) => r.drink_size_id));
}

export interface ScheduledRow extends Omit<PriceHistoryRow, 'status' | 'cancelled_at'> {
  drink_id: string;
  drink_name: string;
}

/** Planned entries dated after `date` of the business's live drinks. */
function plannedAfter(db: Knex, businessId: string, date: string) {
  return db('menu_price_history as h')
    .join('drink_sizes as ds', 'ds.id', 'h.drink_size_id')
    .join('drinks as d', 'd.id', 'ds.drink_id')
    .where('h.business_id', businessId)
    .where('h.status', 'planned')
    .where('h.effective_from', '>', date)
    .whereNull('d.archived_at');
}

/** Planned menu prices dated after `today`, soonest first (live drinks only). */
export async function listScheduled(db: Knex, businessId: string, today: string): Promise<ScheduledRow[]> {
  return plannedAfter(db, businessId, today)
    .join('cup_sizes as cs', 'cs.id', 'ds.size_id')
    .leftJoin('reprice_scenarios as s', 's.id', 'h.scenario_id')
    .leftJoin('users as u', 'u.id', 'h.changed_by')
    .orderBy([{ column: 'h.effective_from' }, { column: 'd.name' }, { column: 'cs.position' }, { column: 'h.changed_at' }])
    .select(
      'h.id', 'h.drink_size_id', 'ds.drink_id', 'd.name as drink_name', 'ds.size_id', 'cs.name as size_name', 'h.old_price', 'h.new_price',
      db.raw("to_char(h.effective_from, 'YYYY-MM-DD') as effective_from"), 'h.reason', 'h.scenario_id', 's.name as scenario_name',
      'h.changed_by', 'u.name as changed_by_name', 'h.changed_at',
    );
}

/** The earliest planned menu price dated after `date` (null when none): "the next change". */
export async function nextPlannedDate(db: Knex, businessId: string, date: string): Promise<string | null> {
  const row = await plannedAfter(db, businessId, date).first(db.raw("to_char(min(h.effective_from), 'YYYY-MM-DD') as d"));
  return (row as { d: string | null } | undefined)?.d ?? null;
}

export const samePrice = (a: string | null, b: string | null) => (a === null || b === null ? a === b : dec(a).eq(dec(b)));

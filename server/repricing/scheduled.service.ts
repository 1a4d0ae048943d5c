import type { Knex } from 'knex';
import { loadMenuRows } from '../costing/cost-model.repo';
import { utcToday as today } from '../platform/clock';
import { money } from '../platform/present';
import { conflict, notFound } from '../platform/errors';
import { presentPriceChange } from './price-list.service';
import { businessName } from './repricing.repo';
import { listScheduled, type ScheduledRow } from './schedule.repo';

function present(r: ScheduledRow, currency: string, currentPrice: string | null | undefined) {
  return {
    ...presentPriceChange(r, currency),
    drinkId: r.drink_id,
    drinkName: r.drink_name,
    currentPrice: money(currentPrice ?? null, currency),
    scheduledBy: r.changed_by ? { id: r.changed_by, name: r.changed_by_name } : null,
    scheduledAt: new Date(r.changed_at).toISOString(),
  };
}

/** GET /api/reprice/scheduled: menu prices applied with a later date, soonest first, beside today's price. */
export async function scheduledPrices(db: Knex, businessId: string) {
  const now = today();
  const [rows, menu, business] = await Promise.all([listScheduled(db, businessId, now), loadMenuRows(db, businessId, undefined, now), businessName(db, businessId)]);
  const currency = business!.currency;
  const inForce = new Map(menu.sizes.map((s) => [s.id, s.price]));
  return { currency, today: now, scheduled: rows.map((r) => present(r, currency, inForce.get(r.drink_size_id))) };
}

/**
 * Cancels a planned menu price before its date (owner, manager). The drink size is locked and its
 * version bumped: a preview worked out against the plan is stale. 409 `not_planned` once the
 * entry is in force, cancelled already, or was applied at once.
 */
export async function cancelScheduled(db: Knex, businessId: string, userId: string, id: string) {
  return db.transaction(async (trx) => {
    const entry = await trx('menu_price_history').where({ business_id: businessId, id }).first('id', 'drink_size_id');
    if (!entry) throw notFound('That planned price');
    await trx('drink_sizes').where({ id: entry.drink_size_id }).forUpdate().first('id');
    const fresh = await trx('menu_price_history').where({ id }).first('status', trx.raw("to_char(effective_from, 'YYYY-MM-DD') as effective_from"));
    if (fresh.status === 'cancelled') throw conflict('not_planned', 'That planned price was already cancelled.');
    if (fresh.status !== 'planned' || fresh.effective_from <= today()) throw conflict('not_planned', `That price is already in force (from ${fresh.effective_from}): apply a new price instead.`);
    await trx('menu_price_history').where({ id }).update({ status: 'cancelled', cancelled_at: trx.fn.now(), cancelled_by: userId });
    await trx('drink_sizes').where({ id: entry.drink_size_id }).update({ price_version: trx.raw('price_version + 1'), updated_at: trx.fn.now() });
    return { id, status: 'cancelled' as const, effectiveFrom: fresh.effective_from as string };
  });
}

import type { Knex } from 'knex';
import { dec, type Dec } from '../../src/shared/decimal';
import { currencyMinorUnits, writeMoney } from '../../src/shared/money';
import type { ApplyInput } from '../../src/shared/schemas/repricing';
import { utcToday as today } from '../platform/clock';
import { conflict, invalidInput, notFound } from '../platform/errors';
import { keepLadder } from './ladder';
import { businessName, findScenario, lockDrinkSizes, type LockedDrinkSize } from './repricing.repo';
import { foldDuePrices, pricesBefore, samePrice, supersedePlanned } from './schedule.repo';

/**
 * Applies new menu prices in ONE transaction: every price is written with its history row
 * (old price, new price, effective date, who, why), or none is.
 *
 * Version check: each drink size's price_version must still be the one the caller saw (sent
 * with each price, or saved in the scenario's snapshot); otherwise someone else changed that
 * price in between and the whole apply is refused with 409 `price_changed`. The rows are locked
 * first (SELECT … FOR UPDATE), so of two applies at once the second waits, then sees the bumped
 * versions and gets the 409 instead of overwriting.
 *
 * Effective dates: dated today or earlier, the new prices become the menu prices at once. Dated
 * later, they are written as 'planned' history rows and drink_sizes.price keeps today's price;
 * reads resolve the price in force on a date (see schedule.repo), and an apply for the same date
 * replaces an earlier plan for it. Either way the drink size's version is bumped, so the version
 * check covers planned prices too. Planned prices that have come due are folded in first.
 */
export async function applyPrices(db: Knex, businessId: string, userId: string, input: ApplyInput) {
  const business = await businessName(db, businessId);
  const currency = business!.currency;
  const places = currencyMinorUnits(currency);
  const fields: Record<string, string> = {};
  const seen = new Set<string>();
  input.prices.forEach((p, i) => {
    if (dec(p.price).decimalPlaces() > places) fields[`prices[${i}].price`] = `Enter the price to ${places} decimal places at most (${currency}).`;
    const key = `${p.drinkId}|${p.size}`;
    if (seen.has(key)) fields[`prices[${i}].size`] = 'That drink size is listed twice.';
    seen.add(key);
  });
  if (Object.keys(fields).length) throw invalidInput(fields);

  return db.transaction(async (trx) => {
    let scenario: Awaited<ReturnType<typeof findScenario>> | undefined;
    if (input.scenarioId) {
      scenario = await findScenario(trx, businessId, input.scenarioId);
      if (!scenario) throw notFound('That scenario');
      // Lock the scenario too: it can be applied once.
      await trx('reprice_scenarios').where({ id: scenario.id }).forUpdate().first('id');
      const fresh = await trx('reprice_scenarios').where({ id: scenario.id }).first('status');
      if (fresh?.status === 'applied') throw conflict('already_applied', `The scenario "${scenario.name}" was already applied.`);
    }

    const drinkIds = [...new Set(input.prices.map((p) => p.drinkId))];
    const locked = await lockDrinkSizes(trx, businessId, drinkIds);
    await foldDuePrices(trx, businessId, locked);
    const planned = input.effectiveFrom > today();
    // The price each size carries just before the new one takes effect (today's when applied now).
    const before = planned ? await pricesBefore(trx, locked, input.effectiveFrom) : new Map(locked.map((r) => [r.id, r.price]));
    const priceBefore = (r: LockedDrinkSize) => before.get(r.id) ?? null;
    const byKey = new Map(locked.map((r) => [`${r.drink_id}|${r.size_name}`, r]));
    const wanted = new Map<string, Dec>();
    input.prices.forEach((p, i) => {
      const row = byKey.get(`${p.drinkId}|${p.size}`);
      if (!row) {
        fields[`prices[${i}].size`] = locked.some((r) => r.drink_id === p.drinkId) ? `That drink is not offered in "${p.size}".` : 'That drink was not found.';
        return;
      }
      wanted.set(row.id, dec(p.price));
    });
    if (Object.keys(fields).length) throw invalidInput(fields);

    // Version check before anything is written.
    const stale: string[] = [];
    input.prices.forEach((p) => {
      const row = byKey.get(`${p.drinkId}|${p.size}`) as LockedDrinkSize;
      const expected = p.priceVersion ?? scenario?.snapshot?.[row.id];
      if (expected !== undefined && expected !== row.price_version) stale.push(`${row.drink_name} (${row.size_name})`);
    });
    if (stale.length) {
      throw conflict(
        'price_changed',
        `Someone else changed ${stale.length === 1 ? 'the price' : 'prices'} of ${stale.slice(0, 5).join(', ')}${stale.length > 5 ? ` and ${stale.length - 5} more` : ''} since you looked. Nothing was applied: review the impact again, then apply.`,
      );
    }

    const final = new Map<string, Dec | null>(wanted);
    if (input.keepLadder) {
      for (const drinkId of drinkIds) {
        const sizes = locked.filter((r) => r.drink_id === drinkId);
        const current = (s: LockedDrinkSize) => (priceBefore(s) === null ? null : dec(priceBefore(s) as string));
        const ladder = keepLadder(sizes.map((s) => ({ id: s.id, current: current(s), chosen: wanted.get(s.id) ?? current(s) })));
        for (const [id, price] of ladder) if (price !== null) final.set(id, price);
      }
    }

    const reason = input.reason ?? (scenario ? `Repricing: ${scenario.name}` : 'Repricing');
    const applied = [];
    // A plan for the same date and size is replaced by this one.
    const superseded = planned ? await supersedePlanned(trx, businessId, locked.filter((r) => final.get(r.id)).map((r) => r.id), input.effectiveFrom, userId) : new Set<string>();
    for (const row of locked) {
      const price = final.get(row.id);
      if (!price) continue;
      if (price.lte(0)) throw invalidInput({ prices: `${row.drink_name} (${row.size_name}) would end at ${writeMoney(price, currency)}: a price must be more than 0.` });
      const unchanged = samePrice(priceBefore(row), price.toFixed());
      if (unchanged && !superseded.has(row.id)) continue;
      const updated = await trx('drink_sizes')
        .where({ id: row.id, price_version: row.price_version })
        .update({ ...(planned ? {} : { price: price.toFixed() }), price_version: row.price_version + 1, updated_at: trx.fn.now() });
      if (updated !== 1) throw conflict('price_changed', `Someone else changed the price of ${row.drink_name} (${row.size_name}) just now. Nothing was applied.`);
      if (unchanged) continue; // only an earlier plan for that date was withdrawn
      await trx('menu_price_history').insert({
        business_id: businessId,
        drink_size_id: row.id,
        old_price: priceBefore(row),
        new_price: price.toFixed(),
        effective_from: input.effectiveFrom,
        reason,
        scenario_id: scenario?.id ?? null,
        changed_by: userId,
        status: planned ? 'planned' : 'applied',
      });
      applied.push({
        drinkId: row.drink_id,
        drinkName: row.drink_name,
        drinkSizeId: row.id,
        size: row.size_name,
        oldPrice: priceBefore(row) === null ? null : writeMoney(priceBefore(row) as string, currency),
        newPrice: writeMoney(price, currency),
        priceVersion: row.price_version + 1,
        effectiveFrom: input.effectiveFrom,
        planned,
      });
    }
    if (scenario) {
      await trx('reprice_scenarios').where({ id: scenario.id }).update({ status: 'applied', applied_by: userId, applied_at: trx.fn.now(), effective_from: input.effectiveFrom, updated_at: trx.fn.now() });
    }
    return { effectiveFrom: input.effectiveFrom, planned, scenarioId: scenario?.id ?? null, applied };
  });
}

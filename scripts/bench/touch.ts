import type { Knex } from 'knex';

/**
 * Moves the business's costing version on without changing any figure (a trigger fires on an
 * update of the currency column even when it is set to itself), so cached costings are stale
 * and the next read is worked out again, as after an owner's edit.
 */
export async function touchCosting(db: Knex, businessId: string) {
  await db('businesses').where({ id: businessId }).update({ currency: db.ref('currency') });
}

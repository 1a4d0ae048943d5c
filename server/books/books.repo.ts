import type { Knex } from 'knex';

// Rows every part of the books reads: the business's currency and its sites.

export async function currencyOf(db: Knex, businessId: string): Promise<string> {
  return (await db('businesses').where({ id: businessId }).first('currency')).currency as string;
}

export async function findSite(db: Knex, businessId: string, siteId: string): Promise<{ id: string; name: string } | undefined> {
  return db('sites').where({ id: siteId, business_id: businessId }).first('id', 'name');
}

/** The business's sites (or the one asked), in the order they were added. */
export async function listSites(db: Knex, businessId: string, siteId: string | null): Promise<{ id: string; name: string }[]> {
  return db('sites').where({ business_id: businessId }).modify((q) => (siteId ? q.where({ id: siteId }) : q)).orderBy('created_at').select('id', 'name');
}

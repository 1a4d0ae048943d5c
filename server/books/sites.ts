import type { Knex } from 'knex';
import { notFound } from '../platform/errors';

/** 404 unless the site is this business's (another business's ids are simply not found). */
export async function assertSite(db: Knex, businessId: string, siteId: string): Promise<{ id: string; name: string }> {
  const site = await db('sites').where({ id: siteId, business_id: businessId }).first('id', 'name');
  if (!site) throw notFound('That site');
  return site;
}

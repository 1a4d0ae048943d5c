import type { Knex } from 'knex';
import type { BusinessRow } from '../auth/users.repo';

export interface SiteRow { id: string; name: string }

export async function listSites(db: Knex, businessId: string): Promise<SiteRow[]> {
  return db('sites').where({ business_id: businessId }).orderBy('created_at').select('id', 'name');
}

export async function insertSite(db: Knex, businessId: string, name: string): Promise<SiteRow> {
  const [site] = await db('sites').insert({ business_id: businessId, name }).returning(['id', 'name']);
  return site;
}

export async function renameSite(db: Knex, businessId: string, id: string, name: string): Promise<SiteRow | undefined> {
  const [site] = await db('sites').where({ id, business_id: businessId }).update({ name, updated_at: db.fn.now() }).returning(['id', 'name']);
  return site;
}

export async function updateBusiness(db: Knex, businessId: string, patch: Partial<Omit<BusinessRow, 'id'>>): Promise<void> {
  await db('businesses').where({ id: businessId }).update({ ...patch, updated_at: db.fn.now() });
}

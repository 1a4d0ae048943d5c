import type { Knex } from 'knex';
import { invalidInput } from '../platform/errors';
import { findSite } from './books.repo';

/**
 * A site named in a body or a query: this business's, or 400 `invalid_input` naming the field
 * (another business's site is the caller's mistake there, not a record to hide).
 */
export async function siteFromInput(db: Knex, businessId: string, siteId: string, field = 'siteId'): Promise<{ id: string; name: string }> {
  const site = await findSite(db, businessId, siteId);
  if (!site) throw invalidInput({ [field]: 'Choose one of your sites.' });
  return site;
}

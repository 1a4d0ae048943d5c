import type { Knex } from 'knex';
import { seesCosts, type Role } from '../../src/shared/capabilities';
import { currencyOf } from './books.repo';

/**
 * Who an answer is for. Counts and waste are read by every role, but figures of cost only by
 * roles that read costs: for the others `currency` is null and the presenters leave every
 * price, value and total out of the answer (not merely hidden by the page).
 */
export interface Audience {
  /** The currency money is written in, or null: this reader sees no money. */
  currency: string | null;
}

export async function audienceOf(db: Knex, user: { role: Role; businessId: string }): Promise<Audience> {
  return { currency: seesCosts(user.role) ? await currencyOf(db, user.businessId) : null };
}

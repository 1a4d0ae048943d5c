import type { Knex } from 'knex';
import type { PolicyRow } from './cost-model.repo';

export type PolicyColumns = Omit<PolicyRow, 'category'>;

/** Replaces the business's policy (category null) and every override, inside `trx`. */
export async function replacePolicies(trx: Knex, businessId: string, base: PolicyColumns, overrides: readonly (PolicyColumns & { category: string })[]): Promise<void> {
  await trx('pricing_policies').where({ business_id: businessId }).delete();
  await trx('pricing_policies').insert([{ business_id: businessId, category: null, ...base }, ...overrides.map((o) => ({ business_id: businessId, ...o }))]);
}

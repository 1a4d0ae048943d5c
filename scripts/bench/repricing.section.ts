import type { Knex } from 'knex';
import { benchRepricing } from './repricing';
import { row } from './measure';

/** Bench section: the repricing impact of one ingredient's change, beside the full-menu costing. */
export async function run(ctx: { db: Knex; businessId: string }) {
  const r = await benchRepricing(ctx.db, ctx.businessId);
  console.log(`\nRepricing: one ingredient +8 % (${r.affectedRows} drink sizes affected)`);
  row('service: full-menu costing, costed afresh', r.menuCosting);
  row('service: repricing impact preview', r.preview, `${r.ratio.toFixed(2)}× the full-menu costing (target < 200 ms: ${r.targetMet ? 'met' : 'NOT met'})`);
}

import type { z } from 'zod';
import type { PricingPolicyBody, policyInSchema } from '../../src/shared/contract/costing';
import { FieldErrors } from '../../src/shared/errors';
import { readPolicy, type PricingPolicy } from '../../src/shared/pricing';
import type { AppDeps } from '../platform/deps';
import { invalidInput } from '../platform/errors';
import { findBusinessMoney, listPolicies } from './cost-model.repo';
import { defaultPolicy, policyFromRow } from './cost-model.service';
import { replacePolicies, type PolicyColumns } from './policy.repo';

type PolicyIn = z.output<typeof policyInSchema>;

export const TAX_CAUTION =
  'Tax rates, and which sales are taxed (eat-in or takeaway, hot or cold, food or drink), depend on where you trade and change from time to time. ' +
  'Confirm your rates and treatment with your tax authority or an accountant; Tamp & Tally only applies the figures you enter here.';

export async function get({ db }: AppDeps, businessId: string): Promise<PricingPolicyBody> {
  const [business, rows] = await Promise.all([findBusinessMoney(db, businessId), listPolicies(db, businessId)]);
  const base = rows.find((r) => r.category === null);
  return {
    currency: business.currency,
    policy: base ? policyFromRow(base) : defaultPolicy(business.currency, business.tax_mode),
    isSet: Boolean(base),
    overrides: rows.filter((r) => r.category !== null).map((r) => ({ category: r.category as string, ...policyFromRow(r) })),
    caution: TAX_CAUTION,
  };
}

const columns = (p: PricingPolicy): PolicyColumns => ({
  target_margin_pct: p.targetMarginPct,
  tax_mode: p.taxMode,
  tax_rate_pct: p.taxRatePct,
  // The column is required; with rounding "none" the step is not used.
  price_step: p.priceStep ?? '0.01',
  rounding: p.rounding,
});

/** Replaces the policy and its overrides; the step must be a whole number of the currency's minor unit (the engine's own check). */
export async function save(deps: AppDeps, businessId: string, input: PolicyIn): Promise<PricingPolicyBody> {
  const { currency } = await findBusinessMoney(deps.db, businessId);
  const overrides = input.overrides ?? [];
  const errors = new FieldErrors();
  readPolicy(input.policy, currency, errors);
  overrides.forEach((o, i) => readPolicy(o, currency, errors, `overrides[${i}]`));
  const seen = new Set<string>();
  overrides.forEach((o, i) => {
    if (seen.has(o.category.toLowerCase())) errors.add(`overrides[${i}].category`, 'This category already has an override.');
    seen.add(o.category.toLowerCase());
  });
  if (errors.any) throw invalidInput(Object.fromEntries(Object.entries(errors.fields).filter(([k]) => k !== 'currency')));
  await deps.db.transaction((trx) => replacePolicies(trx, businessId, columns(input.policy), overrides.map((o) => ({ category: o.category, ...columns(o) }))));
  return get(deps, businessId);
}

import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { pricingPolicySchema } from '../../src/shared/schemas/costing';
import { readPolicy } from '../../src/shared/pricing';
import { FieldErrors } from '../../src/shared/errors';
import type { AppDeps } from '../platform/deps';
import { invalidInput } from '../platform/errors';
import { allow } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { findBusinessMoney, listPolicies } from './cost-model.repo';
import { defaultPolicy, policyFromRow } from './cost-model.service';

export const TAX_CAUTION =
  'Tax rates, and which sales are taxed (eat-in or takeaway, hot or cold, food or drink), depend on where you trade and change from time to time. ' +
  'Confirm your rates and treatment with your tax authority or an accountant; Tamp & Tally only applies the figures you enter here.';

const policyInput = z.object({
  policy: pricingPolicySchema,
  overrides: z.array(pricingPolicySchema.extend({ category: z.string({ error: 'Name the drink category.' }).trim().min(1, 'Name the drink category.').max(60) })).max(50).nullish(),
});

async function present(db: Knex, businessId: string) {
  const [business, rows] = await Promise.all([findBusinessMoney(db, businessId), listPolicies(db, businessId)]);
  const base = rows.find((r) => r.category === null);
  return {
    currency: business!.currency,
    policy: base ? policyFromRow(base) : defaultPolicy(business!.currency, business!.tax_mode),
    isSet: Boolean(base),
    overrides: rows.filter((r) => r.category !== null).map((r) => ({ category: r.category as string, ...policyFromRow(r) })),
    caution: TAX_CAUTION,
  };
}

const columns = (p: z.output<typeof pricingPolicySchema>) => ({
  target_margin_pct: p.targetMarginPct,
  tax_mode: p.taxMode,
  tax_rate_pct: p.taxRatePct,
  // The column is required; with rounding "none" the step is not used.
  price_step: p.priceStep ?? '0.01',
  rounding: p.rounding,
});

export function policyRoutes(deps: AppDeps) {
  const { db } = deps;
  const r = Router();

  r.get('/api/pricing-policy', allow('costs.read'), async (req, res) => {
    res.json(await present(db, req.user!.businessId));
  });

  r.put('/api/pricing-policy', allow('costs.write'), async (req, res) => {
    const b = req.user!.businessId;
    const input = parse(policyInput, req.body);
    const business = await findBusinessMoney(db, b);
    // The step must be a whole number of the currency's minor unit: the engine's own check.
    const errors = new FieldErrors();
    readPolicy(input.policy, business!.currency, errors);
    (input.overrides ?? []).forEach((o, i) => readPolicy(o, business!.currency, errors, `overrides[${i}]`));
    const seen = new Set<string>();
    (input.overrides ?? []).forEach((o, i) => {
      if (seen.has(o.category.toLowerCase())) errors.add(`overrides[${i}].category`, 'This category already has an override.');
      seen.add(o.category.toLowerCase());
    });
    if (errors.any) throw invalidInput(Object.fromEntries(Object.entries(errors.fields).filter(([k]) => k !== 'currency')));
    await db.transaction(async (trx) => {
      await trx('pricing_policies').where({ business_id: b }).delete();
      await trx('pricing_policies').insert([
        { business_id: b, category: null, ...columns(input.policy) },
        ...(input.overrides ?? []).map((o) => ({ business_id: b, category: o.category, ...columns(o) })),
      ]);
    });
    res.json(await present(db, b));
  });

  return r;
}

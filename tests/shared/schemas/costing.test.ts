import { describe, expect, it } from 'vitest';
import { costPreview } from '../../../src/shared/costing';
import { costPreviewRequestSchema, formatFieldPath, parseCostPreviewRequest, zodFieldErrors } from '../../../src/shared/schemas/costing';
import { exampleRequest } from '../example-request';

function fieldsOf(input: unknown): Record<string, string> {
  const r = costPreviewRequestSchema.safeParse(input);
  if (r.success) throw new Error('expected the schema to refuse');
  return zodFieldErrors(r.error);
}

const copy = () => structuredClone(exampleRequest) as unknown as {
  currency: string;
  policy: Record<string, unknown>;
  ingredients: { pack: Record<string, unknown>; yieldPct?: unknown; allergens?: unknown[]; measures?: Record<string, Record<string, unknown>> }[];
  preparations: { yield: Record<string, unknown> }[];
  sizes: { lines: Record<string, unknown>[]; currentPrice?: unknown }[];
};

describe('cost preview schema', () => {
  it('accepts the example and its output costs the same', () => {
    const parsed = parseCostPreviewRequest(exampleRequest);
    expect(costPreview(parsed)).toEqual(costPreview(exampleRequest));
  });

  it('names fields in bracket form', () => {
    const r = copy();
    r.sizes[0].lines[1].unit = 5;
    r.ingredients[0].pack.unit = 'pint';
    r.ingredients[1].yieldPct = '0';
    r.ingredients[0].allergens = ['dairy'];
    r.ingredients[1].measures = { shot: { quantity: '1e2', unit: 'g' } };
    r.preparations[0].yield.quantity = '0';
    r.policy.targetMarginPct = '100';
    r.sizes[0].currentPrice = 3.45;
    const fields = fieldsOf(r);
    expect(Object.keys(fields).sort()).toEqual(
      [
        'sizes[0].lines[1].unit',
        'ingredients[0].pack.unit',
        'ingredients[1].yieldPct',
        'ingredients[0].allergens[0]',
        'ingredients[1].measures.shot.quantity',
        'preparations[0].yield.quantity',
        'policy.targetMarginPct',
        'sizes[0].currentPrice',
      ].sort(),
    );
    expect(fields['ingredients[0].pack.unit']).toBe('Unknown unit "pint".');
    expect(fields['ingredients[1].yieldPct']).toMatch(/yield/);
  });

  it('refuses a price step finer than the currency unit with the engine rule', () => {
    const r = copy();
    r.currency = 'JPY';
    expect(fieldsOf(r)).toEqual({ 'policy.priceStep': "A price step must be a whole number of JPY's smallest unit (1)." });
    const s = copy();
    s.policy.rounding = 'nearest';
    delete s.policy.priceStep;
    expect(Object.keys(fieldsOf(s))).toEqual(['policy.priceStep']);
  });

  it('formats paths', () => {
    expect(formatFieldPath(['sizes', 0, 'lines', 1, 'unit'])).toBe('sizes[0].lines[1].unit');
    expect(formatFieldPath([])).toBe('_');
  });
});

import type { CostPreviewRequest } from '../../src/shared/costing';

/** The cost preview request of the specification (invented café data). */
export const exampleRequest: CostPreviewRequest = {
  currency: 'GBP',
  policy: { targetMarginPct: '72', taxMode: 'inclusive', taxRatePct: '20', priceStep: '0.05', rounding: 'up' },
  ingredients: [
    { key: 'milk', baseUnit: 'ml', densityGPerMl: '1.03', yieldPct: '92', pack: { count: '6', quantity: '2', unit: 'l', price: '9.90' }, allergens: ['milk'] },
    { key: 'beans', baseUnit: 'g', yieldPct: '96', pack: { quantity: '1', unit: 'kg', price: '21.40' }, measures: { shot: { quantity: '9', unit: 'g' } } },
    { key: 'sugar', baseUnit: 'g', pack: { count: '10', quantity: '1', unit: 'kg', price: '11.90' } },
    { key: 'cup12', baseUnit: 'each', pack: { count: '50', quantity: '20', unit: 'each', price: '61.50' } },
  ],
  preparations: [
    {
      key: 'house-syrup',
      yield: { quantity: '1.25', unit: 'l' },
      measures: { pump: { quantity: '7.5', unit: 'ml' } },
      lines: [{ item: 'sugar', quantity: '1', unit: 'kg' }],
    },
  ],
  sizes: [
    {
      name: 'Regular',
      currentPrice: '3.45',
      lines: [
        { item: 'beans', quantity: '2', unit: 'shot' },
        { item: 'milk', quantity: '260', unit: 'ml' },
        { item: 'house-syrup', quantity: '2', unit: 'pump' },
        { item: 'cup12', quantity: '1', unit: 'each' },
      ],
    },
  ],
};

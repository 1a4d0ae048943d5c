import { exampleRequest } from '../shared/example-request';

// The documented request and response of issue 3 (the public contract). The figures follow
// from the formulas there; the VAT fraction (1/6 of a 20 % inclusive price) is HMRC's (secondary).
/** The request of the specification, shared with the engine's tests. */
export const DOCUMENTED_REQUEST = exampleRequest;

export const DOCUMENTED_RESPONSE = {
  currency: 'GBP',
  sizes: [
    {
      name: 'Regular',
      cost: '0.7102',
      lines: [
        { item: 'beans', quantityInBaseUnit: '18', baseUnit: 'g', cost: '0.4013' },
        { item: 'milk', quantityInBaseUnit: '260', baseUnit: 'ml', cost: '0.2332' },
        { item: 'house-syrup', quantityInBaseUnit: '15', baseUnit: 'ml', cost: '0.0143' },
        { item: 'cup12', quantityInBaseUnit: '1', baseUnit: 'each', cost: '0.0615' },
      ],
      suggestedPrice: '3.05',
      atSuggested: { price: '3.05', netPrice: '2.54', tax: '0.51', marginPct: '72.06', costPct: '27.94', profit: '1.83' },
      atCurrent: { price: '3.45', netPrice: '2.88', tax: '0.58', marginPct: '75.30', costPct: '24.70', profit: '2.16' },
    },
  ],
  allergens: ['milk'],
};

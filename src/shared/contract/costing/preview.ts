import { z } from 'zod';
import { costPreviewRequestSchema } from '../../schemas/costing';
import { endpoint } from '../endpoint';
import { allergensSchema, lineCostSchema, priceFiguresSchema } from './common';

/** The preview's answer: per size its cost, lines, suggested price and the figures at both prices. */
export const costPreviewResponseSchema = z.object({
  currency: z.string(),
  sizes: z.array(
    z.object({
      name: z.string(),
      cost: z.string(),
      lines: z.array(lineCostSchema),
      suggestedPrice: z.string(),
      atSuggested: priceFiguresSchema,
      atCurrent: priceFiguresSchema.nullable(),
    }),
  ),
  allergens: allergensSchema,
});

export const previewCosting = endpoint({
  method: 'POST', path: '/api/costing/preview', access: 'costs.read',
  summary: 'Costs a build from the request alone and saves nothing (the worked example above).',
  body: costPreviewRequestSchema, response: costPreviewResponseSchema,
});

import { Router } from 'express';
import { costPreview, CostingInputError } from '../../src/shared/costing';
import { costPreviewRequestSchema } from '../../src/shared/schemas/costing';
import type { AppDeps } from '../platform/deps';
import { invalidInput } from '../platform/errors';
import { allow } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';

export function previewRoutes(_deps: AppDeps) {
  const r = Router();

  // Computes from the request alone and saves nothing: the drink editor calls it as the owner types.
  r.post('/api/costing/preview', allow('costs.read'), (req, res) => {
    const request = parse(costPreviewRequestSchema, req.body);
    try {
      res.json(costPreview(request));
    } catch (e) {
      if (e instanceof CostingInputError) throw invalidInput(e.fields);
      throw e;
    }
  });

  return r;
}

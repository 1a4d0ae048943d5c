import { costPreview, CostingInputError, type CostPreviewRequest, type CostPreviewResponse } from '../../src/shared/costing';
import { invalidInput } from '../platform/errors';

/** Costs from the request alone and saves nothing; what only the whole request shows (an unknown item, a cycle) is a 400 naming the field. */
export function preview(request: CostPreviewRequest): CostPreviewResponse {
  try {
    return costPreview(request);
  } catch (e) {
    if (e instanceof CostingInputError) throw invalidInput(e.fields);
    throw e;
  }
}

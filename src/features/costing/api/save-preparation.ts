import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useCostingMutation } from './keys';
import type { LineIn, PreparationDetail, UnitCode } from './types';

export interface PreparationIn {
  name: string;
  yield: { quantity: string; unit: UnitCode };
  densityGPerMl?: string | null;
  method?: string | null;
  lines: LineIn[];
  measures?: { name: string; quantity: string; unit: UnitCode }[];
}

type Body = { preparation: PreparationDetail };

export function createPreparation(input: PreparationIn): Promise<Body> {
  return apiClient.post(paths.api.preparations(), input);
}

/** The whole preparation, its lines replaced in one transaction. */
export function replacePreparation({ id, ...input }: PreparationIn & { id: string }): Promise<Body> {
  return apiClient.put(paths.api.preparation(id), input);
}

export const useCreatePreparation = () => useCostingMutation(createPreparation);
export const useReplacePreparation = () => useCostingMutation(replacePreparation);

import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useCostingMutation } from './keys';
import type { Modifier, ModifierIn } from './types';

export function createModifier(input: ModifierIn): Promise<{ modifier: Modifier }> {
  return apiClient.post(paths.api.modifiers(), input);
}

/** The whole modifier and its lines for every cup size, replaced in one transaction. */
export function replaceModifier({ id, ...input }: ModifierIn & { id: string }): Promise<{ modifier: Modifier }> {
  return apiClient.put(paths.api.modifier(id), input);
}

export function deleteModifier(id: string): Promise<void> {
  return apiClient.delete(paths.api.modifier(id));
}

export const useCreateModifier = () => useCostingMutation(createModifier);
export const useReplaceModifier = () => useCostingMutation(replaceModifier);
export const useDeleteModifier = () => useCostingMutation(deleteModifier);

import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useCostingMutation } from './keys';
import type { CupSize } from './types';

export interface SizeIn {
  name: string;
  volumeMl: string;
  position?: number;
}

export function createSize(input: SizeIn): Promise<{ size: CupSize }> {
  return apiClient.post(paths.api.sizes(), input);
}

export function updateSize({ id, ...input }: Partial<SizeIn> & { id: string }): Promise<{ size: CupSize }> {
  return apiClient.patch(paths.api.size(id), input);
}

export function deleteSize(id: string): Promise<void> {
  return apiClient.delete(paths.api.size(id));
}

export const useCreateSize = () => useCostingMutation(createSize);
export const useUpdateSize = () => useCostingMutation(updateSize);
export const useDeleteSize = () => useCostingMutation(deleteSize);

import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { PreparationDetail } from './types';

export function getPreparation(id: string): Promise<{ preparation: PreparationDetail; allergenCaution: string }> {
  return apiClient.get(paths.api.preparation(id));
}

export const preparationQueryOptions = (id: string) =>
  queryOptions({ queryKey: [...costingKey, 'preparations', id] as const, queryFn: () => getPreparation(id) });

export function usePreparation(id: string) {
  return useQuery({ ...preparationQueryOptions(id), enabled: id !== '' });
}

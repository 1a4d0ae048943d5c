import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { PreparationSummary } from './types';

export function getPreparations(): Promise<{ preparations: PreparationSummary[]; allergenCaution: string }> {
  return apiClient.get(paths.api.preparations());
}

export const preparationsQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'preparations'] as const, queryFn: getPreparations });

export function usePreparations() {
  return useQuery(preparationsQueryOptions());
}

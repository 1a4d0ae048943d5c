import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { CupSize } from './types';

export function getSizes(): Promise<{ sizes: CupSize[] }> {
  return apiClient.get(paths.api.sizes());
}

export const sizesQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'sizes'] as const, queryFn: getSizes });

export function useSizes() {
  return useQuery(sizesQueryOptions());
}

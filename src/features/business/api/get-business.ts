import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Business } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';

export function getBusiness(): Promise<{ business: Business }> {
  return apiClient.get<{ business: Business }>(paths.api.business());
}

export const businessQueryOptions = () =>
  queryOptions({ queryKey: ['business'] as const, queryFn: getBusiness, select: (d) => d.business });

export function useBusiness() {
  return useQuery(businessQueryOptions());
}

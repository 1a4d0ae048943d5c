import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Site } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';

export function getSites(): Promise<{ sites: Site[] }> {
  return apiClient.get<{ sites: Site[] }>(paths.api.sites());
}

export const sitesQueryOptions = () => queryOptions({ queryKey: ['sites'] as const, queryFn: getSites });

export function useSites() {
  return useQuery(sitesQueryOptions());
}

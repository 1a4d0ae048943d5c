import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { MenuCosting } from './types';

export function getMenuCosting(): Promise<MenuCosting> {
  return apiClient.get(paths.api.menuCosting());
}

export const menuCostingQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'menu'] as const, queryFn: getMenuCosting });

export function useMenuCosting() {
  return useQuery(menuCostingQueryOptions());
}

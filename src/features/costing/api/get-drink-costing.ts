import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { DrinkCosting } from './types';

export function getDrinkCosting(id: string): Promise<DrinkCosting> {
  return apiClient.get(paths.api.drinkCosting(id));
}

export const drinkCostingQueryOptions = (id: string) =>
  queryOptions({ queryKey: [...costingKey, 'drinks', id, 'costing'] as const, queryFn: () => getDrinkCosting(id) });

export function useDrinkCosting(id: string | undefined) {
  return useQuery({ ...drinkCostingQueryOptions(id ?? ''), enabled: Boolean(id) });
}

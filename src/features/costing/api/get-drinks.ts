import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { DrinkSummary } from './types';

export function getDrinks(): Promise<{ drinks: DrinkSummary[] }> {
  return apiClient.get(paths.api.drinks());
}

export const drinksQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'drinks'] as const, queryFn: getDrinks });

export function useDrinks() {
  return useQuery(drinksQueryOptions());
}

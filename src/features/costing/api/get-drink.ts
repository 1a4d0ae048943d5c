import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { Drink } from './types';

export function getDrink(id: string): Promise<{ drink: Drink }> {
  return apiClient.get(paths.api.drink(id));
}

export const drinkQueryOptions = (id: string) => queryOptions({ queryKey: [...costingKey, 'drinks', id] as const, queryFn: () => getDrink(id) });

export function useDrink(id: string | undefined) {
  return useQuery({ ...drinkQueryOptions(id ?? ''), enabled: Boolean(id) });
}

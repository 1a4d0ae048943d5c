import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { RecipeCard } from './types';

export function getCard(id: string): Promise<{ card: RecipeCard }> {
  return apiClient.get(paths.api.drinkCard(id));
}

export const cardQueryOptions = (id: string) => queryOptions({ queryKey: [...costingKey, 'cards', id] as const, queryFn: () => getCard(id) });

export function useCard(id: string) {
  return useQuery(cardQueryOptions(id));
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { IngredientDetail } from './types';

export function getIngredient(id: string): Promise<{ ingredient: IngredientDetail; allergenCaution: string }> {
  return apiClient.get(paths.api.ingredient(id));
}

export const ingredientQueryOptions = (id: string) =>
  queryOptions({ queryKey: [...costingKey, 'ingredients', id] as const, queryFn: () => getIngredient(id) });

export function useIngredient(id: string) {
  return useQuery({ ...ingredientQueryOptions(id), enabled: id !== '' });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { IngredientSummary } from './types';

export function getIngredients(): Promise<{ ingredients: IngredientSummary[]; allergenCaution: string }> {
  return apiClient.get(paths.api.ingredients());
}

export const ingredientsQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'ingredients'] as const, queryFn: getIngredients });

export function useIngredients() {
  return useQuery(ingredientsQueryOptions());
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

/** What the repricing page needs of each ingredient: its costing pack and that pack's price. */
export interface IngredientChoice {
  id: string;
  name: string;
  category: string;
  baseUnit: string;
  costingPack: { id: string; description: string; price: string | null; supplierName: string | null } | null;
}

export const repricingIngredientsQueryOptions = () =>
  queryOptions({
    queryKey: ['reprice', 'ingredients'] as const,
    queryFn: () => apiClient.get<{ ingredients: IngredientChoice[] }>(paths.api.ingredients()),
  });

export function useRepricingIngredients() {
  return useQuery(repricingIngredientsQueryOptions());
}

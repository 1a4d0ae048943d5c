import { keepPreviousData, queryOptions, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { contractQueryOptions } from '../../../lib/contract';
import { getIngredient, getPreparation, type IngredientDetail, type PreparationDetail } from '../../../shared/contract/costing';

export interface BuildDetails {
  ingredients: Map<string, IngredientDetail>;
  preparations: Map<string, PreparationDetail>;
}

/**
 * Everything needed to cost some lines exactly: the detail of each ingredient
 * used (its costing pack, yield, density, measures) and of each preparation,
 * following preparations inside preparations. Each detail comes from (and
 * fills) its own cached query.
 */
async function loadBuildDetails(queryClient: QueryClient, ingredientIds: readonly string[], preparationIds: readonly string[]): Promise<BuildDetails> {
  const ingredients = new Map<string, IngredientDetail>();
  const preparations = new Map<string, PreparationDetail>();
  const wantIngredients = new Set(ingredientIds);
  let wave = [...new Set(preparationIds)];
  while (wave.length > 0) {
    const loaded = await Promise.all(wave.map((id) => queryClient.fetchQuery({ ...contractQueryOptions(getPreparation, { params: { id } }), staleTime: 30_000 })));
    const next: string[] = [];
    for (const { preparation } of loaded) {
      preparations.set(preparation.id, preparation);
      for (const l of preparation.lines) {
        if (l.ingredientId) wantIngredients.add(l.ingredientId);
        if (l.preparationId && !preparations.has(l.preparationId) && !wave.includes(l.preparationId)) next.push(l.preparationId);
      }
    }
    wave = [...new Set(next)];
  }
  const details = await Promise.all([...wantIngredients].map((id) => queryClient.fetchQuery({ ...contractQueryOptions(getIngredient, { params: { id } }), staleTime: 30_000 })));
  for (const { ingredient } of details) ingredients.set(ingredient.id, ingredient);
  return { ingredients, preparations };
}

export const buildDetailsQueryOptions = (queryClient: QueryClient, ingredientIds: readonly string[], preparationIds: readonly string[]) =>
  // The client is the cache the details are read through, not an input of the answer.
  // eslint-disable-next-line @tanstack/query/exhaustive-deps
  queryOptions({
    // Under /api/costing, so a costing write (keys.ts) refreshes it with the rest.
    queryKey: ['/api/costing/build-details', [...ingredientIds].sort(), [...preparationIds].sort()] as const,
    queryFn: () => loadBuildDetails(queryClient, ingredientIds, preparationIds),
    placeholderData: keepPreviousData,
  });

export function useBuildDetails(ingredientIds: readonly string[], preparationIds: readonly string[]) {
  const queryClient = useQueryClient();
  return useQuery(buildDetailsQueryOptions(queryClient, ingredientIds, preparationIds));
}

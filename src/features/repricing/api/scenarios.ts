import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import type { Decision, Impact, PriceChange, Scenario } from './types';

export interface ScenarioBody {
  name: string;
  notes?: string | null;
  changes: PriceChange[];
  asOf?: string | null;
  decisions: Decision[];
  keepLadder: boolean;
}

export const scenariosQueryOptions = () =>
  queryOptions({
    queryKey: ['reprice', 'scenarios'] as const,
    queryFn: () => apiClient.get<{ scenarios: Scenario[] }>(paths.api.repriceScenarios()),
  });

export function useScenarios() {
  return useQuery(scenariosQueryOptions());
}

export const scenarioQueryOptions = (id: string | null) =>
  queryOptions({
    queryKey: ['reprice', 'scenarios', id] as const,
    queryFn: () => apiClient.get<{ scenario: Scenario; impact: Impact | null }>(paths.api.repriceScenario(id as string)),
    enabled: id !== null,
  });

export function useSaveScenario() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id?: string; body: ScenarioBody }) =>
      id
        ? apiClient.put<{ scenario: Scenario; impact: Impact }>(paths.api.repriceScenario(id), body)
        : apiClient.post<{ scenario: Scenario; impact: Impact }>(paths.api.repriceScenarios(), body),
    onSettled: () => queryClient.invalidateQueries({ queryKey: scenariosQueryOptions().queryKey }),
  });
}

export function useDeleteScenario() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiClient.delete(paths.api.repriceScenario(id)),
    onSettled: () => queryClient.invalidateQueries({ queryKey: scenariosQueryOptions().queryKey }),
  });
}

export interface Comparison {
  currency: string | null;
  scenarios: (Scenario & { totals: Impact['totals'] })[];
  rows: { drinkId: string; drinkName: string; drinkSizeId: string; size: string; currentPrice: string | null; cells: ({ newCost: string | null; newPrice: string | null; marginPct: string | null; belowTarget: boolean } | null)[] }[];
}

export const compareQueryOptions = (ids: string[]) =>
  queryOptions({
    queryKey: ['reprice', 'scenarios', 'compare', ids] as const,
    queryFn: () => apiClient.get<Comparison>(paths.api.repriceCompare(ids)),
    enabled: ids.length > 0,
  });

export function useCompareScenarios(ids: string[]) {
  return useQuery(compareQueryOptions(ids));
}

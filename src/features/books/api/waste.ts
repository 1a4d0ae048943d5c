import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { booksKey } from './keys';
import type { WasteEntry } from './types';

export const wasteQueryOptions = (siteId: string | undefined, month: string) =>
  queryOptions({
    queryKey: [...booksKey, 'waste', siteId, month] as const,
    queryFn: () => apiClient.get<{ entries: WasteEntry[]; total: string; currency: string }>(paths.api.waste({ siteId, month })),
    enabled: Boolean(siteId),
  });

export function useWaste(siteId: string | undefined, month: string) {
  return useQuery(wasteQueryOptions(siteId, month));
}

export interface WasteChoiceRow {
  kind: 'ingredient' | 'preparation' | 'drinkSize';
  id: string;
  name: string;
  baseUnit?: 'g' | 'ml' | 'each';
}

/** What waste can be recorded against (no costs: baristas read it too). */
export const wasteChoicesQueryOptions = () =>
  queryOptions({
    queryKey: [...booksKey, 'waste-choices'] as const,
    queryFn: () => apiClient.get<{ choices: WasteChoiceRow[] }>(paths.api.wasteChoices()),
  });

export function useWasteChoices(enabled: boolean) {
  return useQuery({ ...wasteChoicesQueryOptions(), enabled });
}

export interface WasteInput {
  siteId: string;
  occurredOn: string;
  item: { kind: 'ingredient' | 'preparation' | 'drinkSize'; id: string };
  quantity: string;
  unit: string | null;
  reason: string;
}

export function useRecordWaste() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: WasteInput) => apiClient.post<{ entry: { id: string } }>(paths.api.waste(), input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}

export function useDeleteWaste() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiClient.delete(paths.api.wasteEntry(id)),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}

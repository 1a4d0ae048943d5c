import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { CardSummary } from './types';

export function getCards(): Promise<{ cards: CardSummary[] }> {
  return apiClient.get(paths.api.cards());
}

export const cardsQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'cards'] as const, queryFn: getCards });

export function useCards() {
  return useQuery(cardsQueryOptions());
}

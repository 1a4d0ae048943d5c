import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { Modifier } from './types';

export function getModifiers(): Promise<{ modifiers: Modifier[] }> {
  return apiClient.get(paths.api.modifiers());
}

export const modifiersQueryOptions = () => queryOptions({ queryKey: [...costingKey, 'modifiers'] as const, queryFn: getModifiers });

export function useModifiers() {
  return useQuery(modifiersQueryOptions());
}

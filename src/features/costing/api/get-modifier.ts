import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';
import type { Modifier } from './types';

export function getModifier(id: string): Promise<{ modifier: Modifier }> {
  return apiClient.get(paths.api.modifier(id));
}

export const modifierQueryOptions = (id: string) => queryOptions({ queryKey: [...costingKey, 'modifiers', id] as const, queryFn: () => getModifier(id) });

export function useModifier(id: string | undefined) {
  return useQuery({ ...modifierQueryOptions(id ?? ''), enabled: Boolean(id) });
}

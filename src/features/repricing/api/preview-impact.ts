import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import type { Decision, Impact, PriceChange } from './types';

export interface PreviewRequest {
  changes: PriceChange[];
  asOf?: string;
  decisions?: Decision[];
  keepLadder?: boolean;
}

/** A POST that saves nothing: cached like a read, keyed by what was asked. */
export function previewImpact(body: PreviewRequest): Promise<Impact> {
  return apiClient.post<Impact>(paths.api.repricePreview(), body);
}

export const previewQueryOptions = (body: PreviewRequest | null) =>
  queryOptions({
    queryKey: ['reprice', 'preview', body] as const,
    queryFn: () => previewImpact(body as PreviewRequest),
    enabled: body !== null,
    placeholderData: keepPreviousData,
    staleTime: 0,
  });

export function usePreviewImpact(body: PreviewRequest | null) {
  return useQuery(previewQueryOptions(body));
}

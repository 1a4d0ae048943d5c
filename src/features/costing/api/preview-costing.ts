import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CostPreviewRequest, CostPreviewResponse } from '../../../shared/costing';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { costingKey } from './keys';

/** Costs a build from the request alone; the server saves nothing. */
export function previewCosting(request: CostPreviewRequest, signal?: AbortSignal): Promise<CostPreviewResponse> {
  return apiClient.post(paths.api.costingPreview(), request, { signal });
}

// The request is the key: the same build typed again is answered from the cache.
export const previewQueryOptions = (request: CostPreviewRequest | null) =>
  queryOptions({
    queryKey: [...costingKey, 'preview', request] as const,
    queryFn: ({ signal }) => previewCosting(request!, signal),
    enabled: request !== null,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

export function usePreviewCosting(request: CostPreviewRequest | null) {
  return useQuery(previewQueryOptions(request));
}

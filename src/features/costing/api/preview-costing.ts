import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { call } from '../../../lib/contract';
import type { BodyInOf } from '../../../shared/contract/endpoint';
import { previewCosting } from '../../../shared/contract/costing';
import type { CostPreviewRequest } from '../../../shared/costing';

// The request is the key: the same build typed again is answered from the cache.
export const previewQueryOptions = (request: CostPreviewRequest | null) =>
  queryOptions({
    queryKey: [previewCosting.path, request] as const,
    // The engine's request type names units loosely (strings); the server checks each against the contract.
    queryFn: ({ signal }) => call(previewCosting, { body: request as BodyInOf<typeof previewCosting> }, signal),
    enabled: request !== null,
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

/** Costs a build from the request alone; the server saves nothing. */
export function usePreviewCosting(request: CostPreviewRequest | null) {
  return useQuery(previewQueryOptions(request));
}

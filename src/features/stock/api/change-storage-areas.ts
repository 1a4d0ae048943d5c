import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { stockKey } from './get-stock';
import { storageAreasKey, storageAreasQueryOptions, type StorageArea } from './get-storage-areas';

export function createStorageArea({ siteId, name }: { siteId: string; name: string }): Promise<{ area: StorageArea }> {
  return apiClient.post(paths.api.storageAreas(siteId), { name });
}

export function renameStorageArea({ siteId, areaId, name }: { siteId: string; areaId: string; name: string }): Promise<{ area: StorageArea }> {
  return apiClient.patch(paths.api.storageArea(siteId, areaId), { name });
}

/** Every area of the site, in the new order. */
export function reorderStorageAreas({ siteId, areaIds }: { siteId: string; areaIds: string[] }): Promise<{ areas: StorageArea[] }> {
  return apiClient.put(paths.api.storageAreaOrder(siteId), { areaIds });
}

export function deleteStorageArea({ siteId, areaId }: { siteId: string; areaId: string }): Promise<void> {
  return apiClient.delete(paths.api.storageArea(siteId, areaId));
}

/**
 * A change to a site's areas: the area list and the stock list (which names each pack's area)
 * refresh; `onChanged` lets the route refresh what other features show of them (the count sheet).
 */
export function useAreaMutation<I, O>(fn: (input: I) => Promise<O>, onChanged?: () => void, onSuccess?: (out: O, input: I) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess,
    onSettled: () => {
      onChanged?.();
      return Promise.all([queryClient.invalidateQueries({ queryKey: storageAreasKey }), queryClient.invalidateQueries({ queryKey: stockKey })]);
    },
  });
}

export const useCreateStorageArea = (onChanged?: () => void) => useAreaMutation(createStorageArea, onChanged);
export const useRenameStorageArea = (onChanged?: () => void) => useAreaMutation(renameStorageArea, onChanged);
export const useDeleteStorageArea = (onChanged?: () => void) => useAreaMutation(deleteStorageArea, onChanged);

/** Shows the new order at once (the answer is the list in that order), then refreshes. */
export function useReorderStorageAreas(onChanged?: () => void) {
  const queryClient = useQueryClient();
  return useAreaMutation(reorderStorageAreas, onChanged, (r, input) => queryClient.setQueryData(storageAreasQueryOptions(input.siteId).queryKey, r));
}

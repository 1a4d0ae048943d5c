import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useAreaMutation } from './change-storage-areas';

export function setPackStorageArea({ siteId, packId, storageAreaId }: { siteId: string; packId: string; storageAreaId: string | null }): Promise<{ item: { packId: string; storageArea: { id: string; name: string } | null } }> {
  return apiClient.put(paths.api.siteStockItemArea(siteId, packId), { storageAreaId });
}

/** Moving a pack changes the stock list, the areas' pack counts and (through `onChanged`) the count sheet. */
export const useSetPackStorageArea = (onChanged?: () => void) => useAreaMutation(setPackStorageArea, onChanged);

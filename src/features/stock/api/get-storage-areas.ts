import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

/** A place at a site where packs are kept, in the order a count walks them. */
export interface StorageArea {
  id: string;
  name: string;
  position: number;
  /** Stocked packs kept there. */
  packCount: number;
}

export function getStorageAreas(siteId: string): Promise<{ areas: StorageArea[] }> {
  return apiClient.get(paths.api.storageAreas(siteId));
}

/** Every storage-area query starts with this; each change to a site's areas refreshes them by it. */
export const storageAreasKey = ['storage-areas'] as const;

export const storageAreasQueryOptions = (siteId: string) => queryOptions({ queryKey: [...storageAreasKey, siteId] as const, queryFn: () => getStorageAreas(siteId) });

export function useStorageAreas(siteId: string | undefined, enabled = true) {
  return useQuery({ ...storageAreasQueryOptions(siteId ?? ''), enabled: Boolean(siteId) && enabled });
}

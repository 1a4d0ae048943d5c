import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

/** One pack's stock at a site, in packs. */
export interface StockItem {
  packId: string;
  description: string;
  supplier: { id: string; name: string } | null;
  /** Where the pack is kept at the site; null when it is in no area yet. */
  storageArea: { id: string; name: string } | null;
  onHand: string;
  par: string;
  reorderPoint: string;
  atOrBelowReorder: boolean;
  suggested: string;
  movements?: { counted: string; received: string; waste: string };
}

export interface SiteStock {
  site: { id: string; name: string };
  /** The day of the last finished stock count, or null when none yet. */
  countedOn: string | null;
  items: StockItem[];
  notes?: string[];
}

export function getStock(siteId: string): Promise<SiteStock> {
  return apiClient.get(paths.api.siteStock(siteId));
}

/** Every stock query starts with this; receiving a delivery elsewhere refreshes them by it. */
export const stockKey = ['stock'] as const;

export const stockQueryOptions = (siteId: string) => queryOptions({ queryKey: [...stockKey, siteId] as const, queryFn: () => getStock(siteId) });

export function useStock(siteId: string | undefined) {
  return useQuery({ ...stockQueryOptions(siteId ?? ''), enabled: Boolean(siteId) });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { stockKey, type StockItem } from './get-stock';

export function updateStockLevel({ siteId, packId, par, reorderPoint }: { siteId: string; packId: string; par: string; reorderPoint: string }): Promise<{ item: StockItem }> {
  return apiClient.put(paths.api.siteStockItem(siteId, packId), { par, reorderPoint });
}

/** Saving a par level changes what is suggested for the site: the route also refreshes its suggested orders. */
export function useUpdateStockLevel(onSaved?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateStockLevel,
    onSuccess: () => {
      onSaved?.();
      return queryClient.invalidateQueries({ queryKey: stockKey });
    },
  });
}

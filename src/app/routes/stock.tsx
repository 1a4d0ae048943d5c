import { useQueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { CardSection } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { formatDate } from '../../lib/format';
import { useMe } from '../../features/auth/api/get-me';
import { ordersKey } from '../../features/orders/api/get-orders';
import { SuggestedOrder } from '../../features/orders/components/suggested-order';
import { useStock } from '../../features/stock/api/get-stock';
import { useStorageAreas } from '../../features/stock/api/get-storage-areas';
import { StockTable } from '../../features/stock/components/stock-table';
import { StorageAreas } from '../../features/stock/components/storage-areas';
import { invalidate, useContractQuery } from '../../lib/contract';
import { listSuppliers } from '../../shared/contract/suppliers';
import { useWorkSite } from './work-site';

/** Stock at the chosen site, its par levels, and what to order from each supplier. */
export function StockRoute() {
  const me = useMe();
  const work = useWorkSite();
  const site = work.site;
  const stock = useStock(site?.id);
  const suppliers = useContractQuery(listSuppliers);
  const queryClient = useQueryClient();
  const [params, setParams] = useSearchParams();
  const role = me.data?.user.role;
  const canEdit = role === 'owner' || role === 'manager';
  const list = suppliers.data?.suppliers ?? [];
  const supplierId = list.find((s) => s.id === params.get('supplierId'))?.id ?? list[0]?.id;
  const areas = useStorageAreas(site?.id, canEdit);
  // Count sheets group packs by area: a change here shows there on the next look.
  // A moved pack moves in the site's open counts too: their sheets read again.
  const areasChanged = () => invalidate(queryClient, '/api/stock-counts');

  return (
    <div className="flex max-w-6xl flex-col gap-6">
      <PageHeader
        title={site ? `Stock and ordering at ${site.name}` : 'Stock and ordering'}
        description="What is on hand in packs, the par level each pack is topped up to, the reorder point that triggers it, and the order each supplier needs. Change site in the top bar."
      />
      {work.pending ? (
        <SkeletonRows rows={4} label="Loading the site" />
      ) : !site ? (
        work.error ? <ErrorState error={work.error} /> : <EmptyState title="No site yet" next="Add a site in Settings first." />
      ) : (
        <>
          <CardSection title="Suggested order">
            {suppliers.isError ? (
              <ErrorState error={suppliers.error} onRetry={() => suppliers.refetch()} />
            ) : suppliers.isPending ? (
              <SkeletonRows rows={2} label="Loading the suppliers" />
            ) : list.length === 0 ? (
              <EmptyState title="No suppliers yet" next="Add a supplier and their packs; their suggested order appears here." />
            ) : (
              <SuggestedOrder siteId={site.id} supplierId={supplierId} suppliers={list} canOrder={canEdit} onSupplierChange={(id) => setParams({ supplierId: id }, { replace: true })} />
            )}
          </CardSection>
          <section aria-labelledby="stock-heading" className="flex flex-col gap-3">
            <div>
              <h2 id="stock-heading" className="text-lg font-bold text-ink">Stock on hand</h2>
              <p className="max-w-prose text-sm text-muted">
                {stock.data?.countedOn ? `The stock count of ${formatDate(stock.data.countedOn)}` : 'No stock count yet: the deliveries received'}, plus deliveries since, minus recorded waste and what the till sales since used by their recipes.
                {canEdit ? ' Change a par level or reorder point and press Save (or Enter).' : ''}
              </p>
            </div>
            {stock.isPending ? (
              <SkeletonRows rows={6} label="Loading the stock" />
            ) : stock.isError ? (
              <ErrorState error={stock.error} onRetry={() => stock.refetch()} />
            ) : stock.data.items.length === 0 ? (
              <EmptyState title="No packs held here yet" next="Packs appear once they have a supplier; then set a par level for each." />
            ) : (
              <StockTable
                siteId={site.id}
                items={stock.data.items}
                canEdit={canEdit}
                areas={areas.data?.areas}
                onLevelSaved={() => queryClient.invalidateQueries({ queryKey: ordersKey })}
                onAreaChanged={areasChanged}
              />
            )}
          </section>
          {canEdit && (
            <CardSection title="Storage areas">
              <StorageAreas siteId={site.id} onChanged={areasChanged} />
            </CardSection>
          )}
        </>
      )}
    </div>
  );
}

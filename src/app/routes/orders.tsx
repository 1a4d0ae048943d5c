import { ButtonLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useOrders } from '../../features/orders/api/get-orders';
import { OrdersTable } from '../../features/orders/components/orders-table';

export function OrdersRoute() {
  const me = useMe();
  const orders = useOrders();
  const role = me.data?.user.role;
  const canOrder = role === 'owner' || role === 'manager';
  const start = canOrder ? <ButtonLink to={paths.stock.href()}>Start an order</ButtonLink> : undefined;
  return (
    <div className="flex max-w-6xl flex-col gap-6">
      <PageHeader title="Purchase orders" description="Orders to suppliers at every site: drafts, sent, paid, delivered and closed." action={start} />
      {orders.isPending ? (
        <SkeletonRows rows={6} label="Loading the orders" />
      ) : orders.isError ? (
        <ErrorState error={orders.error} onRetry={() => orders.refetch()} />
      ) : orders.data.orders.length === 0 ? (
        <EmptyState title="No purchase orders yet" next="Open Stock to see what is running low at a site and order it from the supplier." action={start} />
      ) : (
        <OrdersTable orders={orders.data.orders} />
      )}
    </div>
  );
}

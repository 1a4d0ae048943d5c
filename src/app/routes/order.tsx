import { useParams } from 'react-router-dom';
import { TextLink } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { formatDate } from '../../lib/format';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useConfig } from '../../features/config/api/get-config';
import { useOrder } from '../../features/orders/api/get-order';
import { OrderDetail } from '../../features/orders/components/order-detail';

export function OrderRoute() {
  const { orderId = '' } = useParams();
  const me = useMe();
  const config = useConfig();
  const order = useOrder(orderId);
  const o = order.data;
  return (
    <div className="flex max-w-6xl flex-col gap-2">
      <p className="text-sm"><TextLink to={paths.orders.href()}>All orders</TextLink></p>
      <PageHeader
        title={o ? `${o.number}: ${o.supplier.name}` : 'Purchase order'}
        description={o ? `For ${o.site.name}, started ${formatDate(o.createdAt)}.` : undefined}
      />
      {order.isError ? (
        <ErrorState error={order.error} onRetry={() => order.refetch()} />
      ) : !o || !me.data ? (
        <SkeletonRows rows={6} label="Loading the order" />
      ) : (
        <OrderDetail order={o} role={me.data.user.role} devMailboxUrl={config.data?.devMailboxUrl ?? null} />
      )}
    </div>
  );
}

import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { TextLink } from '../../components/ui/button';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { invalidateCosting } from '../../features/costing/api/keys';
import { useOrder } from '../../features/orders/api/get-order';
import { ReceiptSummary, ReceiveForm } from '../../features/orders/components/receive-form';
import type { ReceiptResult } from '../../features/orders/api/types';
import { stockKey } from '../../features/stock/api/get-stock';

export function OrderReceiveRoute() {
  const { orderId = '' } = useParams();
  const order = useOrder(orderId);
  const queryClient = useQueryClient();
  const [receipt, setReceipt] = useState<ReceiptResult | null>(null);
  const o = order.data;
  const receivable = o && (o.status === 'paid' || o.status === 'part_received' || (o.status === 'placed' && o.paymentTerms === 'account'));
  return (
    <div className="flex max-w-6xl flex-col gap-2">
      <p className="text-sm">{o ? <TextLink to={paths.order.href(o.id)}>Back to {o.number}</TextLink> : <TextLink to={paths.orders.href()}>All orders</TextLink>}</p>
      <PageHeader title={o ? `Receive ${o.number} from ${o.supplier.name}` : 'Receive a delivery'} description={o ? `Into stock at ${o.site.name}.` : undefined} />
      {order.isError ? (
        <ErrorState error={order.error} onRetry={() => order.refetch()} />
      ) : !o ? (
        <SkeletonRows rows={5} label="Loading the order" />
      ) : receipt ? (
        <ReceiptSummary order={o} result={receipt} onPriceSaved={() => invalidateCosting(queryClient)} />
      ) : !receivable ? (
        <EmptyState
          title="This order cannot be received now"
          next={o.status === 'placed' ? 'It is paid by card when ordering: an owner pays it first.' : 'It is a draft, already delivered in full, closed or cancelled.'}
        />
      ) : (
        <ReceiveForm
          order={o}
          onReceived={(r) => {
            setReceipt(r);
            return queryClient.invalidateQueries({ queryKey: stockKey });
          }}
        />
      )}
    </div>
  );
}

import { useId } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { TextLink } from '../../components/ui/button';
import { CardSection } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { Select } from '../../components/ui/input';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useOrder } from '../../features/orders/api/get-order';
import { useSuggestedOrder } from '../../features/orders/api/get-suggested-order';
import { OrderEditor, type EditorTarget } from '../../features/orders/components/order-editor';
import { useContractQuery } from '../../lib/contract';
import { listSuppliers } from '../../shared/contract/suppliers';
import { useWorkSite } from './work-site';

function Shell({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div className="flex max-w-5xl flex-col gap-2">
      <p className="text-sm"><TextLink to={paths.orders.href()}>All orders</TextLink></p>
      <PageHeader title={title} description="Choose the packs and how many; the totals follow as you type. The draft is not sent until you place it." />
      {children}
    </div>
  );
}

/** A new draft (/orders/new?siteId&supplierId[&suggested=1]) or a saved draft's lines (/orders/:orderId/edit). */
export function OrderEditorRoute() {
  const { orderId } = useParams();
  return orderId ? <EditDraft orderId={orderId} /> : <NewDraft />;
}

function EditDraft({ orderId }: { orderId: string }) {
  const order = useOrder(orderId);
  const suppliers = useContractQuery(listSuppliers);
  const o = order.data;
  if (order.isError) return <Shell title="Edit the order"><ErrorState error={order.error} onRetry={() => order.refetch()} /></Shell>;
  if (!o || suppliers.isPending) return <Shell title="Edit the order"><SkeletonRows rows={5} label="Loading the order" /></Shell>;
  if (o.status !== 'draft')
    return (
      <Shell title={`Edit ${o.number}`}>
        <EmptyState title="Only a draft can be edited" next={<>This order has been placed. <TextLink to={paths.order.href(o.id)}>Back to {o.number}</TextLink></>} />
      </Shell>
    );
  const target: EditorTarget = {
    site: o.site,
    supplier: { id: o.supplier.id, name: o.supplier.name, minimumOrder: o.supplier.minimumOrder, deliveryCharge: o.deliveryCharge },
    currency: o.currency,
    order: { id: o.id, number: o.number, version: o.version },
    lines: o.lines.map((l) => ({ packId: l.packId, quantity: l.quantity })),
    notes: o.notes ?? '',
  };
  return <Shell title={`Edit ${o.number} for ${o.supplier.name}`}><OrderEditor target={target} /></Shell>;
}

function NewDraft() {
  const me = useMe();
  const work = useWorkSite();
  const suppliers = useContractQuery(listSuppliers);
  const [params, setParams] = useSearchParams();
  const selectId = useId();
  const site = work.sites.find((s) => s.id === params.get('siteId')) ?? work.site;
  const supplier = suppliers.data?.suppliers.find((s) => s.id === params.get('supplierId'));
  const fromSuggested = params.get('suggested') === '1';
  const suggested = useSuggestedOrder(site?.id, supplier?.id, fromSuggested);
  const currency = me.data?.business.currency ?? 'GBP';

  if (work.pending || suppliers.isPending) return <Shell title="New purchase order"><SkeletonRows rows={5} label="Loading" /></Shell>;
  if (suppliers.isError) return <Shell title="New purchase order"><ErrorState error={suppliers.error} onRetry={() => suppliers.refetch()} /></Shell>;
  if (!site) return <Shell title="New purchase order"><EmptyState title="No site yet" next="Add a site in Settings first." /></Shell>;
  if (!supplier)
    return (
      <Shell title={`New purchase order for ${site.name}`}>
        <CardSection title="Who is it for?">
          <div className="flex max-w-sm flex-col gap-1">
            <label htmlFor={selectId} className="text-sm font-medium text-ink">Supplier</label>
            <Select id={selectId} value="" onChange={(e) => setParams({ siteId: site.id, supplierId: e.target.value })}>
              <option value="">Choose a supplier</option>
              {suppliers.data.suppliers.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
            </Select>
          </div>
        </CardSection>
      </Shell>
    );
  const title = `New order from ${supplier.name} for ${site.name}`;
  if (fromSuggested && suggested.isError) return <Shell title={title}><ErrorState error={suggested.error} onRetry={() => suggested.refetch()} /></Shell>;
  if (fromSuggested && !suggested.data) return <Shell title={title}><SkeletonRows rows={5} label="Working out the suggested order" /></Shell>;
  const target: EditorTarget = {
    site,
    supplier: { id: supplier.id, name: supplier.name, minimumOrder: supplier.minimumOrder, deliveryCharge: supplier.deliveryCharge },
    currency,
    lines: fromSuggested ? (suggested.data?.lines ?? []).map((l) => ({ packId: l.packId, quantity: l.quantity })) : [],
    notes: '',
  };
  return <Shell title={title}><OrderEditor key={`${site.id}/${supplier.id}/${fromSuggested}`} target={target} /></Shell>;
}

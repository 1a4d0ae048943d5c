import { useCallback, useId } from 'react';
import { ButtonLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { StatusMark } from '../../../components/ui/status-mark';
import { Table, Td, THead, useSortedRows } from '../../../components/ui/table';
import { formatDate, formatMoney, formatQuantity } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { useSuggestedOrder } from '../api/get-suggested-order';
import type { SuggestedOrder as Suggested } from '../api/types';
import { termsLabel } from './order-status';

/**
 * What to order from one supplier for a site: packs at or below their reorder point topped
 * up to par in whole packs, priced today, with the minimum and the next delivery day.
 */
export function SuggestedOrder({ siteId, supplierId, suppliers, onSupplierChange, canOrder }: {
  siteId: string;
  supplierId: string | undefined;
  suppliers: { id: string; name: string }[];
  onSupplierChange: (id: string) => void;
  canOrder: boolean;
}) {
  const selectId = useId();
  const suggested = useSuggestedOrder(siteId, supplierId);
  const s = suggested.data;
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div className="flex min-w-64 flex-col gap-1">
          <label htmlFor={selectId} className="text-sm font-medium text-ink">Supplier</label>
          <Select id={selectId} value={supplierId ?? ''} onChange={(e) => onSupplierChange(e.target.value)}>
            {!supplierId && <option value="">Choose a supplier</option>}
            {suppliers.map((x) => <option key={x.id} value={x.id}>{x.name}</option>)}
          </Select>
        </div>
        {canOrder && supplierId && (
          <div className="flex flex-wrap gap-3">
            <ButtonLink variant="secondary" to={paths.newOrder.href({ siteId, supplierId })}>Start a blank order</ButtonLink>
            {s && s.lines.length > 0 && <ButtonLink to={paths.newOrder.href({ siteId, supplierId, suggested: true })}>Order these</ButtonLink>}
          </div>
        )}
      </div>
      {!supplierId ? (
        <EmptyState title="Choose a supplier" next="The suggested order lists their packs that are at or below the reorder point here." />
      ) : suggested.isPending ? (
        <SkeletonRows rows={3} label="Working out the suggested order" />
      ) : suggested.isError ? (
        <ErrorState error={suggested.error} onRetry={() => suggested.refetch()} />
      ) : s!.lines.length === 0 ? (
        <EmptyState title={`Nothing is low from ${s!.supplier.name}`} next="Every pack from them is above its reorder point. Start a blank order if you need something anyway." />
      ) : (
        <>
          <SuggestedLines suggested={s!} />
          <dl className="grid gap-x-8 gap-y-1 text-sm sm:grid-cols-[auto_auto] sm:justify-end">
            <dt className="text-muted">Goods</dt><dd className="text-right tabular-nums">{formatMoney(s!.subtotal, s!.currency)}</dd>
            <dt className="text-muted">Purchase tax</dt><dd className="text-right tabular-nums">{formatMoney(s!.tax, s!.currency)}</dd>
            <dt className="text-muted">Delivery</dt><dd className="text-right tabular-nums">{formatMoney(s!.deliveryCharge, s!.currency)}</dd>
            <dt className="font-medium">Total</dt><dd className="text-right font-bold tabular-nums">{formatMoney(s!.total, s!.currency)}</dd>
          </dl>
          <div className="flex flex-wrap gap-3 text-sm">
            {s!.minimumShortfall && (
              <StatusMark tone="attention">
                {formatMoney(s!.minimumShortfall, s!.currency)} short of their {formatMoney(s!.supplier.minimumOrder, s!.currency)} minimum
              </StatusMark>
            )}
            <span className="text-ink">
              {s!.nextDelivery ? <>Next delivery if ordered now: <strong>{formatDate(s!.nextDelivery)}</strong></> : 'This supplier has no delivery days set.'}
            </span>
            <span className="text-muted">· {termsLabel(s!.supplier.paymentTerms)}</span>
          </div>
        </>
      )}
    </div>
  );
}

type Line = Suggested['lines'][number];
type LineKey = 'description' | 'onHand' | 'reorderPoint' | 'par' | 'quantity' | 'unitPrice' | 'lineTotal';

/** One supplier's low packs, sortable by any column; short enough not to need a filter. */
function SuggestedLines({ suggested: s }: { suggested: Suggested }) {
  const value = useCallback((l: Line, key: LineKey) => l[key], []);
  const { sorted, header } = useSortedRows<Line, LineKey>(s.lines, null, value);
  return (
    <Table caption={`Suggested order from ${s.supplier.name}`}>
      <THead>
        <tr>
          {header('description', 'Pack', false)}
          {header('onHand', 'On hand')}
          {header('reorderPoint', 'Reorder point')}
          {header('par', 'Par level')}
          {header('quantity', 'Order')}
          {header('unitPrice', 'Pack price')}
          {header('lineTotal', 'Line total')}
        </tr>
      </THead>
      <tbody>
        {sorted.map((l) => (
          <tr key={l.packId}>
            <Td>{l.description}</Td>
            <Td figure>{formatQuantity(l.onHand)}</Td>
            <Td figure>{formatQuantity(l.reorderPoint)}</Td>
            <Td figure>{formatQuantity(l.par)}</Td>
            <Td figure className="font-medium">{formatQuantity(l.quantity)}</Td>
            <Td figure>{l.unitPrice ? formatMoney(l.unitPrice, s.currency) : <span className="text-rose">no price</span>}</Td>
            <Td figure>{formatMoney(l.lineTotal, s.currency)}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

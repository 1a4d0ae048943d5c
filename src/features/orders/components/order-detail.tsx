import { useCallback, useState, type ReactNode } from 'react';
import { Button, ButtonLink } from '../../../components/ui/button';
import { Card, CardSection } from '../../../components/ui/card';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { FormMessage } from '../../../components/ui/form-message';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, Td, THead, useSortedRows } from '../../../components/ui/table';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { type Role } from '../../../shared/capabilities';
import { formatDate, formatMoney, formatQuantity } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { useOrderAction } from '../api/order-actions';
import { dec } from '../../../shared/decimal';
import type { Order, OrderLine } from '../api/types';
import { InvoiceUpload } from './invoice-upload';
import { OrderStatusMark, paymentWords, termsLabel } from './order-status';
import { OrderTimeline } from './order-timeline';
import { PayDialog } from './pay-dialog';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex flex-col">
      <dt className="text-sm text-muted">{label}</dt>
      <dd className="text-ink">{children}</dd>
    </div>
  );
}

function actionError(err: unknown): string {
  if (!isApiError(err)) return 'That did not work. Try again.';
  if (err.code === 'mail_failed') return `${err.message} The order is still a draft: try placing it again.`;
  return err.message;
}

type LineKey = 'description' | 'quantity' | 'quantityReceived' | 'unitPrice' | 'taxPct' | 'lineTotal';

/** The order's lines in the order they were entered, sortable by any column. */
function OrderLines({ order }: { order: Order }) {
  const { currency } = order;
  const anyReceived = order.lines.some((l) => !dec(l.quantityReceived).isZero());
  const value = useCallback((l: OrderLine, key: LineKey) => l[key], []);
  const { sorted, sort, onSort } = useSortedRows<OrderLine, LineKey>(order.lines, null, value);
  return (
    <Table caption={`Lines of ${order.number}`}>
      <THead>
        <tr>
          <SortHeader label="Pack" sortKey="description" sort={sort} onSort={onSort} />
          <SortHeader label="Ordered" sortKey="quantity" sort={sort} onSort={onSort} figure />
          {anyReceived && <SortHeader label="Received" sortKey="quantityReceived" sort={sort} onSort={onSort} figure />}
          <SortHeader label="Unit price" sortKey="unitPrice" sort={sort} onSort={onSort} figure />
          <SortHeader label="Tax" sortKey="taxPct" sort={sort} onSort={onSort} figure />
          <SortHeader label="Line total" sortKey="lineTotal" sort={sort} onSort={onSort} figure />
        </tr>
      </THead>
      <tbody>
        {sorted.map((l) => (
          <tr key={l.id} data-line={l.packId}>
            <Td>
              {l.description}
              {l.note && <span className="block text-xs text-muted">{l.note}</span>}
            </Td>
            <Td figure>{formatQuantity(l.quantity)}</Td>
            {anyReceived && (
              <Td figure>
                {formatQuantity(l.quantityReceived)}
                {dec(l.quantityReceived).lt(dec(l.quantity)) && <span className="ml-2"><StatusMark tone="attention">short</StatusMark></span>}
              </Td>
            )}
            <Td figure>{formatMoney(l.unitPrice, currency)}</Td>
            <Td figure>{formatQuantity(l.taxPct)}%</Td>
            <Td figure>{formatMoney(l.lineTotal, currency)}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

/** One purchase order: its lines and totals, where it stands, what can be done next, and its timeline. */
export function OrderDetail({ order, role, devMailboxUrl }: { order: Order; role: Role; devMailboxUrl: string | null }) {
  const action = useOrderAction();
  const { notify } = useToast();
  const [paying, setPaying] = useState(false);
  const [cancelling, setCancelling] = useState(false);
  const write = role === 'owner' || role === 'manager';
  const owner = role === 'owner';
  const { currency } = order;
  const pay = paymentWords(order);
  const paidByCard = order.payment?.status === 'succeeded';
  const confirming = order.payment?.confirming ?? false;
  const card = order.paymentTerms === 'card';
  const canPay = owner && card && order.status === 'placed' && !confirming;
  const canReceive = write && (order.status === 'paid' || order.status === 'part_received' || (order.status === 'placed' && !card));
  const canCancel = write && (order.status === 'draft' || (order.status === 'placed' && !confirming) || (order.status === 'paid' && owner));
  const canClose = write && (order.status === 'received' || order.status === 'part_received');

  const run = (a: 'place' | 'close' | 'payment/check' | 'cancel', done: string) =>
    action.mutate({ id: order.id, action: a }, { onSuccess: () => { notify(done); setCancelling(false); } });

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center gap-3">
        <OrderStatusMark status={order.status} />
        {pay && <StatusMark tone={pay.tone}>{pay.label}</StatusMark>}
        {order.minimumShortfall && order.status === 'draft' && (
          <StatusMark tone="attention">{formatMoney(order.minimumShortfall, currency)} below the supplier's minimum</StatusMark>
        )}
      </div>

      <FormMessage>{action.isError ? actionError(action.error) : null}</FormMessage>

      {(order.status === 'draft' || canPay || canReceive || canClose || canCancel || confirming) && (
        <div className="flex flex-wrap gap-3" role="group" aria-label="What to do next">
          {order.status === 'draft' && write && (
            <>
              <Button busy={action.isPending && action.variables?.action === 'place'} disabled={order.lines.length === 0} onClick={() => run('place', `${order.number} placed and e-mailed.`)}>
                Place and e-mail the order
              </Button>
              <ButtonLink variant="secondary" to={paths.editOrder.href(order.id)}>Edit the draft</ButtonLink>
            </>
          )}
          {canPay && <Button onClick={() => setPaying(true)}>Pay by card</Button>}
          {confirming && owner && (
            <Button variant="secondary" busy={action.isPending && action.variables?.action === 'payment/check'} onClick={() => run('payment/check', 'Payment checked.')}>
              Check the payment now
            </Button>
          )}
          {canReceive && <ButtonLink to={paths.receiveOrder.href(order.id)}>Receive the delivery</ButtonLink>}
          {canClose && <Button variant="secondary" busy={action.isPending && action.variables?.action === 'close'} onClick={() => run('close', `${order.number} closed.`)}>Close the order</Button>}
          {canCancel && <Button variant="secondary" onClick={() => setCancelling(true)}>Cancel the order</Button>}
        </div>
      )}
      {order.status === 'placed' && card && !owner && write && (
        <p className="text-sm text-muted">This supplier is paid by card when ordering: an owner pays it before the delivery can be received.</p>
      )}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="flex min-w-0 flex-col gap-6">
          <OrderLines order={order} />
          <dl className="ml-auto grid min-w-64 grid-cols-[1fr_auto] gap-x-6 gap-y-1 text-sm" data-totals>
            <dt className="text-muted">Goods</dt><dd className="text-right tabular-nums" data-total="subtotal">{formatMoney(order.subtotal, currency)}</dd>
            <dt className="text-muted">Purchase tax</dt><dd className="text-right tabular-nums" data-total="tax">{formatMoney(order.tax, currency)}</dd>
            <dt className="text-muted">Delivery</dt><dd className="text-right tabular-nums" data-total="delivery">{formatMoney(order.deliveryCharge, currency)}</dd>
            <dt className="border-t border-rule pt-1 font-medium">Total</dt>
            <dd className="border-t border-rule pt-1 text-right text-base font-bold tabular-nums" data-total="total">{formatMoney(order.total, currency)}</dd>
          </dl>
          {order.notes && <p className="text-ink"><span className="font-medium">Notes for the supplier:</span> {order.notes}</p>}

          {order.receipts.length > 0 && (
            <CardSection title="Deliveries">
              <ul className="flex flex-col gap-3">
                {order.receipts.map((r) => (
                  <li key={r.id}>
                    <p className="text-ink">
                      Received {formatDate(r.receivedOn)}{r.receivedBy ? ` by ${r.receivedBy}` : ''}{r.invoiceNumber ? ` · invoice ${r.invoiceNumber}` : ''}
                    </p>
                    {r.notes && <p className="text-sm text-muted">{r.notes}</p>}
                  </li>
                ))}
              </ul>
            </CardSection>
          )}

          <CardSection title="Timeline">
            <OrderTimeline events={order.timeline} />
          </CardSection>
        </div>

        <Card className="h-fit">
          <dl className="flex flex-col gap-3">
            <Fact label="Site">{order.site.name}</Fact>
            <Fact label="Supplier">{order.supplier.name}</Fact>
            <Fact label="How paid">{termsLabel(order.paymentTerms)}</Fact>
            <Fact label="Expected delivery">{order.expectedOn ? formatDate(order.expectedOn) : 'Worked out when the order is placed'}</Fact>
            <Fact label="Order e-mail">
              {order.email ? (
                <span data-email-sent>
                  Sent to <span className="break-all font-medium">{order.email.to}</span> on {formatDate(order.email.sentAt, { withTime: true })}, with {order.number}.pdf
                </span>
              ) : order.supplier.orderEmail ? (
                <span>Not sent yet; goes to <span className="break-all">{order.supplier.orderEmail}</span> when placed</span>
              ) : (
                <StatusMark tone="attention">The supplier has no order e-mail</StatusMark>
              )}
              {order.email && devMailboxUrl && (
                <a href={devMailboxUrl} target="_blank" rel="noreferrer" className="mt-1 block text-sm font-medium text-ink underline decoration-copper decoration-2 underline-offset-2">
                  Open the development mailbox
                </a>
              )}
            </Fact>
            {pay && (
              <Fact label="Payment">
                <span className="font-medium">{pay.label}</span>
                {pay.detail && <span className="block text-sm text-ink" data-payment-detail>{pay.detail}</span>}
                {order.paidAt && paidByCard && <span className="block text-sm text-muted">Paid {formatDate(order.paidAt, { withTime: true })}</span>}
                {order.payment?.status === 'requires_action' && order.payment.nextActionUrl && (
                  <a href={order.payment.nextActionUrl} target="_blank" rel="noreferrer" className="mt-1 block text-sm font-medium text-ink underline decoration-copper decoration-2 underline-offset-2">
                    Open the card's confirmation page
                  </a>
                )}
              </Fact>
            )}
            <Fact label="Supplier's invoice">
              {order.invoice ? (
                <a href={order.invoice.url} target="_blank" rel="noreferrer" className="font-medium text-ink underline decoration-copper decoration-2 underline-offset-2">
                  {order.invoice.name}
                </a>
              ) : (
                <span className="text-muted">None uploaded yet</span>
              )}
            </Fact>
          </dl>
          {write && order.status !== 'draft' && order.status !== 'cancelled' && (
            <div className="mt-4 border-t border-rule pt-4">
              <InvoiceUpload order={order} />
            </div>
          )}
        </Card>
      </div>

      {owner && <PayDialog order={order} open={paying} onClose={() => setPaying(false)} />}
      <ConfirmDialog
        open={cancelling}
        title={`Cancel ${order.number}?`}
        consequence={
          order.status === 'paid'
            ? `The card payment of ${formatMoney(order.total, currency)} is refunded first, then the order is cancelled. Let the supplier know: they are not told automatically.`
            : order.status === 'placed'
              ? 'The order is cancelled and cannot be placed again. The supplier already has the e-mail: let them know.'
              : 'The draft is cancelled and kept in the list as cancelled.'
        }
        confirmLabel={order.status === 'paid' ? 'Refund and cancel' : 'Cancel the order'}
        busy={action.isPending && action.variables?.action === 'cancel'}
        error={action.isError && action.variables?.action === 'cancel' ? actionError(action.error) : null}
        onCancel={() => { setCancelling(false); action.reset(); }}
        onConfirm={() => run('cancel', `${order.number} cancelled.`)}
      />
    </div>
  );
}

import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { StatusMark } from '../../../components/ui/status-mark';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney } from '../../../lib/format';
import { useCancelScheduledPrice, useScheduledPrices, type ScheduledPrice } from '../api/scheduled-prices';

/** Menu prices applied with a later date: today's price, the new one and its date; cancellable until then. */
export function ScheduledPrices({ canCancel }: { canCancel: boolean }) {
  const list = useScheduledPrices();
  const cancel = useCancelScheduledPrice();
  const toast = useToast();
  const [asking, setAsking] = useState<ScheduledPrice | null>(null);
  if (list.isPending) return <SkeletonRows rows={2} label="Loading scheduled prices" />;
  if (list.isError) return <ErrorState error={list.error} onRetry={() => list.refetch()} />;
  const { currency, scheduled } = list.data;
  if (scheduled.length === 0) return <EmptyState title="No menu price changes scheduled" next="Apply new prices with a later date to schedule them; the current prices stay until then." />;
  const error = cancel.error ? (isApiError(cancel.error) ? cancel.error.message : 'The change could not be cancelled. Try again.') : null;
  return (
    <>
      <Table caption="Scheduled menu price changes">
        <THead>
          <tr>
            <Th>Takes effect</Th>
            <Th>Drink</Th>
            <Th>Size</Th>
            <Th figure>Price now</Th>
            <Th figure>New price</Th>
            <Th>Why</Th>
            {canCancel && <Th>Cancel</Th>}
          </tr>
        </THead>
        <tbody>
          {scheduled.map((s) => (
            <tr key={s.id}>
              <Td>
                {formatDate(s.effectiveFrom)} <StatusMark tone="info">Planned</StatusMark>
              </Td>
              <Td>{s.drinkName}</Td>
              <Td>{s.size}</Td>
              <Td figure>{s.currentPrice ? formatMoney(s.currentPrice, currency) : '—'}</Td>
              <Td figure>{formatMoney(s.newPrice, currency)}</Td>
              <Td>{s.scenarioName ? `Scenario: ${s.scenarioName}` : (s.reason ?? '—')}</Td>
              {canCancel && (
                <Td>
                  <Button size="sm" variant="secondary" onClick={() => setAsking(s)}>
                    Cancel change
                  </Button>
                </Td>
              )}
            </tr>
          ))}
        </tbody>
      </Table>
      <ConfirmDialog
        open={asking !== null}
        title="Cancel this scheduled price?"
        consequence={
          asking && (
            <p>
              {asking.drinkName} · {asking.size} will not change to {formatMoney(asking.newPrice, currency)} on {formatDate(asking.effectiveFrom)}. The change stays in the price history, marked cancelled.
            </p>
          )
        }
        confirmLabel="Cancel the change"
        busy={cancel.isPending}
        error={asking ? error : null}
        onConfirm={() =>
          asking &&
          cancel.mutate(asking.id, {
            onSuccess: () => {
              toast.notify(`Scheduled price for ${asking.drinkName} (${asking.size}) cancelled.`);
              setAsking(null);
            },
          })
        }
        onCancel={() => setAsking(null)}
      />
    </>
  );
}

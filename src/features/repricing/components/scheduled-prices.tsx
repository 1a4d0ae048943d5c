import { useCallback, useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, TableFilters, TableSearch, Td, Th, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney } from '../../../lib/format';
import { useCancelScheduledPrice, useScheduledPrices, type ScheduledPrice } from '../api/scheduled-prices';

type SortKey = 'effectiveFrom' | 'drinkName' | 'size' | 'currentPrice' | 'newPrice' | 'why';

const why = (s: ScheduledPrice) => (s.scenarioName ? `Scenario: ${s.scenarioName}` : (s.reason ?? ''));

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
      <ScheduledTable scheduled={scheduled} currency={currency} canCancel={canCancel} onCancel={setAsking} />
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

function ScheduledTable({ scheduled, currency, canCancel, onCancel }: { scheduled: ScheduledPrice[]; currency: string; canCancel: boolean; onCancel: (s: ScheduledPrice) => void }) {
  const [search, setSearch] = useState('');
  const shown = useMemo(() => scheduled.filter((s) => matchesSearch(search, s.drinkName, s.size, why(s))), [scheduled, search]);
  const value = useCallback((s: ScheduledPrice, key: SortKey) => (key === 'why' ? why(s) : s[key]), []);
  const { sorted, sort, onSort } = useSortedRows<ScheduledPrice, SortKey>(shown, null, value);
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={scheduled.length}>
        <TableSearch label="Search scheduled prices" value={search} onChange={setSearch} placeholder="Drink, size or why" />
      </TableFilters>
      {sorted.length === 0 ? (
        <EmptyState title="No scheduled price matches" next="Clear the search to see every scheduled change." />
      ) : (
        <Table caption="Scheduled menu price changes">
          <THead>
            <tr>
              <SortHeader label="Takes effect" sortKey="effectiveFrom" sort={sort} onSort={onSort} />
              <SortHeader label="Drink" sortKey="drinkName" sort={sort} onSort={onSort} />
              <SortHeader label="Size" sortKey="size" sort={sort} onSort={onSort} />
              <SortHeader label="Price now" sortKey="currentPrice" sort={sort} onSort={onSort} figure />
              <SortHeader label="New price" sortKey="newPrice" sort={sort} onSort={onSort} figure />
              <SortHeader label="Why" sortKey="why" sort={sort} onSort={onSort} />
              {canCancel && <Th>Cancel</Th>}
            </tr>
          </THead>
          <tbody>
            {sorted.map((s) => (
              <tr key={s.id}>
                <Td>
                  {formatDate(s.effectiveFrom)} <StatusMark tone="info">Planned</StatusMark>
                </Td>
                <Td>{s.drinkName}</Td>
                <Td>{s.size}</Td>
                <Td figure>{s.currentPrice ? formatMoney(s.currentPrice, currency) : '—'}</Td>
                <Td figure>{formatMoney(s.newPrice, currency)}</Td>
                <Td>{why(s) || '—'}</Td>
                {canCancel && (
                  <Td>
                    <Button size="sm" variant="secondary" onClick={() => onCancel(s)}>
                      Cancel change
                    </Button>
                  </Td>
                )}
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

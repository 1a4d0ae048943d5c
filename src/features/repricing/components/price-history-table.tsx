import { useCallback, useMemo, useState } from 'react';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Select } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, TableFilters, TableSearch, Td, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import { formatDate, formatMoney } from '../../../lib/format';
import type { PriceHistory } from '../api/get-price-history';

type Change = PriceHistory['history'][number];
type SortKey = 'effectiveFrom' | 'size' | 'oldPrice' | 'newPrice' | 'why' | 'who' | 'changedAt';

const why = (h: Change) => (h.scenarioName ? `Scenario: ${h.scenarioName}` : (h.reason ?? ''));

/** Every menu price change of one drink: when, which size, old → new, why and who; planned and cancelled ones marked. */
export function PriceHistoryTable({ data }: { data: PriceHistory }) {
  const [search, setSearch] = useState('');
  const [status, setStatus] = useState('');
  const shown = useMemo(() => data.history.filter((h) => (!status || h.status === status) && matchesSearch(search, h.size, why(h), h.changedBy?.name)), [data.history, search, status]);
  const value = useCallback((h: Change, key: SortKey) => (key === 'why' ? why(h) : key === 'who' ? h.changedBy?.name : h[key]), []);
  const { sorted, sort, onSort } = useSortedRows<Change, SortKey>(shown, null, value);
  if (data.history.length === 0) return <EmptyState title="No price changes yet" next="Prices set in the drink editor or applied from repricing show here." />;
  const c = data.currency;
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={data.history.length}>
        <TableSearch label="Search the history" value={search} onChange={setSearch} placeholder="Size, why or who" />
        <Field label="Show" className="w-48">
          <Select value={status} onChange={(e) => setStatus(e.target.value)}>
            <option value="">Every change</option>
            <option value="applied">In force or past</option>
            <option value="planned">Planned</option>
            <option value="cancelled">Cancelled</option>
          </Select>
        </Field>
      </TableFilters>
      {sorted.length === 0 ? (
        <EmptyState title="No change matches" next="Clear the search or choose every change." />
      ) : (
        <Table caption={`Price history of ${data.drink.name}`}>
          <THead>
            <tr>
              <SortHeader label="Takes effect" sortKey="effectiveFrom" sort={sort} onSort={onSort} />
              <SortHeader label="Size" sortKey="size" sort={sort} onSort={onSort} />
              <SortHeader label="Old price" sortKey="oldPrice" sort={sort} onSort={onSort} figure />
              <SortHeader label="New price" sortKey="newPrice" sort={sort} onSort={onSort} figure />
              <SortHeader label="Why" sortKey="why" sort={sort} onSort={onSort} />
              <SortHeader label="Who" sortKey="who" sort={sort} onSort={onSort} />
              <SortHeader label="Changed" sortKey="changedAt" sort={sort} onSort={onSort} />
            </tr>
          </THead>
          <tbody>
            {sorted.map((h) => (
              <tr key={h.id}>
                <Td>
                  {formatDate(h.effectiveFrom)}
                  {h.status === 'planned' && (
                    <>
                      {' '}
                      <StatusMark tone="info">Planned</StatusMark>
                    </>
                  )}
                  {h.status === 'cancelled' && (
                    <>
                      {' '}
                      <StatusMark tone="neutral">Cancelled</StatusMark>
                    </>
                  )}
                </Td>
                <Td>{h.size}</Td>
                <Td figure>{h.oldPrice ? formatMoney(h.oldPrice, c) : '—'}</Td>
                <Td figure>{formatMoney(h.newPrice, c)}</Td>
                <Td>{why(h) || '—'}</Td>
                <Td>{h.changedBy?.name ?? '—'}</Td>
                <Td>{formatDate(h.changedAt, { withTime: true })}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

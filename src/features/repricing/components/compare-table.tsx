import { useCallback, useMemo, useState } from 'react';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { SortHeader, Table, TableFilters, TableSearch, Td, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import { useCompareScenarios, type Comparison as ComparisonData } from '../api/scenarios';
import { Money, Pct, TargetMark } from './figures';

type Row = ComparisonData['rows'][number];
/** 'drink', 'currentPrice', or a scenario's column by its index ('0', '1', …). */
type SortKey = string;

/** Scenarios side by side: the money for each, then per drink size the price and margin each gives. */
export function CompareTable({ ids }: { ids: string[] }) {
  const q = useCompareScenarios(ids);
  if (q.isPending) return <SkeletonRows rows={4} label="Comparing the scenarios" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  return <Comparison data={q.data} />;
}

function Comparison({ data }: { data: ComparisonData }) {
  const c = data.currency ?? 'GBP';
  const [search, setSearch] = useState('');
  const shown = useMemo(() => data.rows.filter((r) => matchesSearch(search, r.drinkName, r.size)), [data.rows, search]);
  const value = useCallback((r: Row, key: SortKey) => (key === 'drink' ? `${r.drinkName} ${r.size}` : key === 'currentPrice' ? r.currentPrice : r.cells[Number(key)]?.newPrice), []);
  const { sorted, sort, onSort } = useSortedRows<Row, SortKey>(shown, null, value);
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={data.rows.length}>
        <TableSearch label="Search the comparison" value={search} onChange={setSearch} placeholder="Drink or size" />
      </TableFilters>
      <Table caption="Scenarios side by side">
        <THead>
          <tr>
            <SortHeader label="Drink and size" sortKey="drink" sort={sort} onSort={onSort} />
            <SortHeader label="Price now" sortKey="currentPrice" sort={sort} onSort={onSort} figure />
            {data.scenarios.map((s, k) => (
              <SortHeader key={s.id} label={s.name} sortKey={String(k)} sort={sort} onSort={onSort} figure />
            ))}
          </tr>
        </THead>
        {/* The scenarios' totals stay on top whatever the rows' order. */}
        <tbody>
          <tr className="bg-paper font-medium">
            <Td>Profit change a month</Td>
            <Td />
            {data.scenarios.map((s) => (
              <Td key={s.id} figure><Money value={s.totals.monthlyProfitChange} currency={c} /></Td>
            ))}
          </tr>
          <tr className="bg-paper font-medium">
            <Td>Sizes below target</Td>
            <Td />
            {data.scenarios.map((s) => (
              <Td key={s.id} figure>{s.totals.belowTargetAtNewPrices}</Td>
            ))}
          </tr>
        </tbody>
        <tbody>
          {sorted.map((r) => (
            <tr key={r.drinkSizeId}>
              <Td>{r.drinkName} <span className="text-muted">· {r.size}</span></Td>
              <Td figure><Money value={r.currentPrice} currency={c} /></Td>
              {r.cells.map((cell, k) => (
                <Td key={k} figure>
                  {cell ? (
                    <>
                      <Money value={cell.newPrice} currency={c} /> <span className="text-xs text-muted">(<Pct value={cell.marginPct} />)</span>
                      {cell.belowTarget && <div className="mt-1"><TargetMark below /></div>}
                    </>
                  ) : (
                    '—'
                  )}
                </Td>
              ))}
            </tr>
          ))}
        </tbody>
      </Table>
      {sorted.length === 0 && <EmptyState title="No drink size matches" next="Clear the search to compare every size." />}
    </div>
  );
}

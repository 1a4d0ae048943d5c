import { ErrorState } from '../../../components/ui/error-state';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { useCompareScenarios } from '../api/scenarios';
import { Money, Pct, TargetMark } from './figures';

/** Scenarios side by side: the money for each, then per drink size the price and margin each gives. */
export function CompareTable({ ids }: { ids: string[] }) {
  const q = useCompareScenarios(ids);
  if (q.isPending) return <SkeletonRows rows={4} label="Comparing the scenarios" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const c = q.data.currency ?? 'GBP';
  return (
    <Table caption="Scenarios side by side">
      <THead>
        <tr>
          <Th>Drink and size</Th>
          <Th figure>Price now</Th>
          {q.data.scenarios.map((s) => (
            <Th key={s.id} figure>{s.name}</Th>
          ))}
        </tr>
      </THead>
      <tbody>
        <tr className="bg-paper font-medium">
          <Td>Profit change a month</Td>
          <Td />
          {q.data.scenarios.map((s) => (
            <Td key={s.id} figure><Money value={s.totals.monthlyProfitChange} currency={c} /></Td>
          ))}
        </tr>
        <tr className="bg-paper font-medium">
          <Td>Sizes below target</Td>
          <Td />
          {q.data.scenarios.map((s) => (
            <Td key={s.id} figure>{s.totals.belowTargetAtNewPrices}</Td>
          ))}
        </tr>
        {q.data.rows.map((r) => (
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
  );
}

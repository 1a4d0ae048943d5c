import { useCallback, useMemo, useState } from 'react';
import { EmptyState } from '../../../components/ui/empty-state';
import { Table, TableFilters, TableSearch, Td, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import type { Impact, ModifierImpactRow } from '../api/types';
import { Money, Pct, TargetMark } from './figures';

type SortKey = 'name' | 'oldCostDelta' | 'newCostDelta' | 'upcharge' | 'oldMarginPct' | 'newMarginPct' | 'target' | 'suggestedUpcharge';

/** Add-ons and swaps whose extra cost moves: the upcharge set, and one that keeps the target. */
export function ModifiersTable({ impact }: { impact: Impact }) {
  const { currency } = impact;
  const [search, setSearch] = useState('');
  const shown = useMemo(() => impact.modifiers.filter((m) => matchesSearch(search, m.modifierName, m.size, ...m.ingredients)), [impact.modifiers, search]);
  const value = useCallback(
    (m: ModifierImpactRow, key: SortKey) => (key === 'name' ? `${m.modifierName} ${m.size}` : key === 'target' ? (m.belowTarget ? 0 : m.upcharge !== null ? 1 : 2) : m[key]),
    [],
  );
  const { sorted, header } = useSortedRows<ModifierImpactRow, SortKey>(shown, null, value);
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={impact.modifiers.length}>
        <TableSearch label="Search add-ons and swaps" value={search} onChange={setSearch} placeholder="Name, size or ingredient" />
      </TableFilters>
      {sorted.length === 0 ? (
        <EmptyState title="No add-on or swap matches" next="Clear the search to see them all." />
      ) : (
        <Table caption="Add-ons and swaps affected">
          <THead>
            <tr>
              {header('name', 'Add-on or swap', false)}
              {header('oldCostDelta', 'Extra cost before')}
              {header('newCostDelta', 'Extra cost after')}
              {header('upcharge', 'Upcharge')}
              {header('oldMarginPct', 'Margin before')}
              {header('newMarginPct', 'Margin after')}
              {header('target', 'Target', false)}
              {header('suggestedUpcharge', 'Suggested upcharge')}
            </tr>
          </THead>
          <tbody>
            {sorted.map((m) => (
              <tr key={`${m.modifierId}|${m.sizeId}`}>
                <Td className="min-w-40">
                  <div className="font-medium">{m.modifierName} <span className="font-normal">· {m.size}</span></div>
                  <div className="text-xs text-muted">{m.ingredients.join(', ')}</div>
                </Td>
                <Td figure><Money value={m.oldCostDelta} currency={currency} detail /></Td>
                <Td figure><Money value={m.newCostDelta} currency={currency} detail /></Td>
                <Td figure><Money value={m.upcharge} currency={currency} /></Td>
                <Td figure><Pct value={m.oldMarginPct} /></Td>
                <Td figure><Pct value={m.newMarginPct} /></Td>
                <Td><TargetMark below={m.belowTarget} hasPrice={m.upcharge !== null} /></Td>
                <Td figure><Money value={m.suggestedUpcharge} currency={currency} /></Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

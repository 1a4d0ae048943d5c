import { useCallback, useMemo, useState } from 'react';
import { TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, TableFilters, TableSearch, Td, Th, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import { formatMoney, formatQuantity } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { ALLERGENS } from '../../../shared/allergens';
import type { PreparationSummary } from '../../../shared/contract/costing';
import { unitSymbol } from './units';

type SortKey = 'name' | 'batchCost' | 'unitCost' | 'allergens';

const allergenText = (p: PreparationSummary) => p.allergens.map((a) => ALLERGENS[a].split(' (')[0]).join(', ');

/**
 * What the café makes in batches: yield, cost per batch and per unit. The yield column does not
 * sort: batches are made in different units (litres, grams, portions).
 */
export function PreparationsTable({ preparations, currency }: { preparations: PreparationSummary[]; currency: string }) {
  const [search, setSearch] = useState('');
  const shown = useMemo(() => preparations.filter((p) => matchesSearch(search, p.name, allergenText(p))), [preparations, search]);
  const value = useCallback((p: PreparationSummary, key: SortKey) => (key === 'allergens' ? allergenText(p) : p[key]), []);
  const { sorted, sort, onSort } = useSortedRows<PreparationSummary, SortKey>(shown, { key: 'name', direction: 'asc' }, value);
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={preparations.length}>
        <TableSearch label="Search preparations" value={search} onChange={setSearch} placeholder="Name or allergen" />
      </TableFilters>
      {sorted.length === 0 ? (
        <EmptyState title="No preparation matches" next="Clear the search, or add the preparation." />
      ) : (
        <Table caption="Preparations">
          <THead>
            <tr>
              <SortHeader label="Preparation" sortKey="name" sort={sort} onSort={onSort} />
              <Th figure>One batch makes</Th>
              <SortHeader label="Cost per batch" sortKey="batchCost" sort={sort} onSort={onSort} figure />
              <SortHeader label="Cost per unit" sortKey="unitCost" sort={sort} onSort={onSort} figure />
              <SortHeader label="Allergens" sortKey="allergens" sort={sort} onSort={onSort} />
            </tr>
          </THead>
          <tbody>
            {sorted.map((p) => (
              <tr key={p.id}>
                <Td>
                  <TextLink to={paths.preparation.href(p.id)}>{p.name}</TextLink>
                </Td>
                <Td figure>{formatQuantity(p.yield.quantity, unitSymbol(p.yield.unit))}</Td>
                <Td figure>{p.batchCost ? formatMoney(p.batchCost, currency, { detail: true }) : <StatusMark tone="attention">cannot be costed</StatusMark>}</Td>
                <Td figure>
                  {p.unitCost ? (
                    <>
                      {formatMoney(p.unitCost, currency, { detail: true })} <span className="text-muted">/ {p.baseUnit}</span>
                    </>
                  ) : (
                    <span className="text-muted">{p.problem ?? '—'}</span>
                  )}
                </Td>
                <Td>{p.allergens.length ? allergenText(p) : <span className="text-muted">none entered</span>}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

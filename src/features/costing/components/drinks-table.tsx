import { useCallback, useMemo, useState } from 'react';
import { TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { SortHeader, Table, Td, THead, useSortedRows } from '../../../components/ui/table';
import { formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import type { DrinkSummary } from '../../../shared/contract/costing';

type SortKey = 'name' | 'category' | 'temperature';

/** Every drink with its sizes and menu prices; each opens in the editor. */
export function DrinksTable({ drinks, currency }: { drinks: DrinkSummary[]; currency: string }) {
  const [search, setSearch] = useState('');
  const shown = useMemo(() => drinks.filter((d) => `${d.name} ${d.category}`.toLowerCase().includes(search.trim().toLowerCase())), [drinks, search]);
  const value = useCallback((d: DrinkSummary, key: SortKey) => d[key], []);
  const { sorted, sort, onSort } = useSortedRows<DrinkSummary, SortKey>(shown, { key: 'name', direction: 'asc' }, value);
  return (
    <div className="flex flex-col gap-4">
      <Field label="Search drinks" className="max-w-sm">
        <Input type="search" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="Name or category" />
      </Field>
      {sorted.length === 0 ? (
        <EmptyState title="No drink matches" next="Clear the search, or add the drink." />
      ) : (
        <Table caption="Drinks">
          <THead>
            <tr>
              <SortHeader label="Drink" sortKey="name" sort={sort} onSort={onSort} />
              <SortHeader label="Category" sortKey="category" sort={sort} onSort={onSort} />
              <SortHeader label="Served" sortKey="temperature" sort={sort} onSort={onSort} />
              <th scope="col" className="px-3 py-2 font-medium text-muted">
                Sizes and menu prices
              </th>
            </tr>
          </THead>
          <tbody>
            {sorted.map((d) => (
              <tr key={d.id}>
                <Td>
                  <TextLink to={paths.drink.href(d.id)}>{d.name}</TextLink>
                </Td>
                <Td>{d.category}</Td>
                <Td>{d.temperature === 'hot' ? 'Hot' : 'Iced'}</Td>
                <Td>
                  <ul className="flex flex-wrap gap-x-4 gap-y-1">
                    {d.sizes.map((s) => (
                      <li key={s.sizeId} className="tabular-nums">
                        <span className="text-muted">{s.name}</span> {s.currentPrice ? formatMoney(s.currentPrice, currency) : <span className="text-muted">no price</span>}
                      </li>
                    ))}
                  </ul>
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

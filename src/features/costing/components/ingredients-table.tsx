import { useCallback, useMemo, useState } from 'react';
import { TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Input, Select } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, Td, THead, useSortedRows, type SortValue } from '../../../components/ui/table';
import { formatMoney, formatQuantity } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { ALLERGENS } from '../../../shared/allergens';
import { categoryLabels } from './options';
import type { IngredientSummary } from '../../../shared/contract/costing';
import { CategoryOptions } from './options';
import { unitSymbol } from './units';

type SortKey = 'name' | 'category' | 'unitCost' | 'pack' | 'supplier';

/** The ingredients with their cost per base unit and per measure, and the pack that sets the cost. */
export function IngredientsTable({ ingredients, currency }: { ingredients: IngredientSummary[]; currency: string }) {
  const [search, setSearch] = useState('');
  const [category, setCategory] = useState('');
  const shown = useMemo(
    () =>
      ingredients.filter(
        (i) =>
          (!category || i.category === category) &&
          (!search.trim() || `${i.name} ${i.costingPack?.supplierName ?? ''}`.toLowerCase().includes(search.trim().toLowerCase())),
      ),
    [ingredients, search, category],
  );
  const value = useCallback((i: IngredientSummary, key: SortKey): SortValue => {
    if (key === 'unitCost') return i.unitCost;
    if (key === 'category') return categoryLabels[i.category];
    if (key === 'pack') return i.costingPack?.description ?? '';
    if (key === 'supplier') return i.costingPack?.supplierName ?? '';
    return i.name;
  }, []);
  const { sorted, sort, onSort } = useSortedRows<IngredientSummary, SortKey>(shown, { key: 'name', direction: 'asc' }, value);
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <Field label="Search ingredients" className="w-64">
          <Input type="search" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="Name or supplier" />
        </Field>
        <Field label="Category" className="w-56">
          <Select value={category} onChange={(e) => setCategory(e.target.value)}>
            <option value="">All categories</option>
            <CategoryOptions />
          </Select>
        </Field>
        <p className="pb-2 text-sm text-muted tabular-nums">
          {sorted.length} of {ingredients.length}
        </p>
      </div>
      {sorted.length === 0 ? (
        <EmptyState title="No ingredient matches" next="Clear the search or choose all categories." />
      ) : (
        <Table caption="Ingredients">
          <THead>
            <tr>
              <SortHeader label="Ingredient" sortKey="name" sort={sort} onSort={onSort} />
              <SortHeader label="Category" sortKey="category" sort={sort} onSort={onSort} />
              <SortHeader label="Cost per base unit" sortKey="unitCost" sort={sort} onSort={onSort} figure />
              <th scope="col" className="px-3 py-2 text-right font-medium text-muted">
                Cost per measure
              </th>
              <SortHeader label="Costing pack" sortKey="pack" sort={sort} onSort={onSort} />
              <SortHeader label="Supplier" sortKey="supplier" sort={sort} onSort={onSort} />
            </tr>
          </THead>
          <tbody>
            {sorted.map((i) => (
              <tr key={i.id} data-row={i.name}>
                <Td>
                  <TextLink to={paths.ingredient.href(i.id)}>{i.name}</TextLink>
                  {i.allergens.length > 0 && (
                    <p className="mt-0.5 text-xs text-muted">Allergens: {i.allergens.map((a) => ALLERGENS[a].split(' (')[0]).join(', ')}</p>
                  )}
                </Td>
                <Td>{categoryLabels[i.category]}</Td>
                <Td figure data-col="unit-cost">
                  {i.unitCost ? (
                    <>
                      {formatMoney(i.unitCost, currency, { detail: true })} <span className="text-muted">/ {i.baseUnit}</span>
                    </>
                  ) : (
                    <span title={i.problem ?? undefined}>
                      <StatusMark tone="attention">no price</StatusMark>
                    </span>
                  )}
                </Td>
                <Td figure>
                  {i.measures.length === 0 ? (
                    <span className="text-muted">—</span>
                  ) : (
                    <ul>
                      {i.measures.map((m) => (
                        <li key={m.id} className="whitespace-nowrap">
                          <span className="text-muted">
                            {m.name} ({formatQuantity(m.quantity, unitSymbol(m.unit))})
                          </span>{' '}
                          {m.cost ? formatMoney(m.cost, currency, { detail: true }) : '—'}
                        </li>
                      ))}
                    </ul>
                  )}
                </Td>
                <Td>
                  {i.costingPack ? (
                    <>
                      {i.costingPack.description}
                      {i.costingPack.price && <span className="ml-2 tabular-nums text-muted">{formatMoney(i.costingPack.price, currency)}</span>}
                    </>
                  ) : (
                    <span className="text-muted">{i.problem ?? 'No pack yet'}</span>
                  )}
                </Td>
                <Td>{i.costingPack?.supplierName ?? <span className="text-muted">—</span>}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

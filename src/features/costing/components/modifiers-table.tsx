import { useCallback, useMemo, useState } from 'react';
import { TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { SortHeader, Table, Td, Th, THead, useSortedRows } from '../../../components/ui/table';
import { formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import type { CupSize, Modifier } from '../../../shared/contract/costing';
import { UpchargeMark } from './upcharge-mark';

type SortKey = 'name' | 'kind' | 'upcharge';

export const kindLabels = { add: 'Add-on', swap: 'Swap' } as const;

/**
 * Every modifier with its menu upcharge and, per cup size, what it adds to the
 * cost of the cup and the upcharge that would keep the target margin on it.
 */
export function ModifiersTable({ modifiers, sizes, currency }: { modifiers: Modifier[]; sizes: CupSize[]; currency: string }) {
  const [search, setSearch] = useState('');
  const shown = useMemo(() => modifiers.filter((m) => m.name.toLowerCase().includes(search.trim().toLowerCase())), [modifiers, search]);
  const value = useCallback((m: Modifier, key: SortKey) => (key === 'upcharge' ? m.upcharge : m[key]), []);
  const { sorted, sort, onSort } = useSortedRows<Modifier, SortKey>(shown, { key: 'name', direction: 'asc' }, value);
  return (
    <div className="flex flex-col gap-4">
      <Field label="Search modifiers" className="max-w-sm">
        <Input type="search" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="Name" />
      </Field>
      {sorted.length === 0 ? (
        <EmptyState title="No modifier matches" next="Clear the search, or add the modifier." />
      ) : (
        <Table caption="Modifiers, with the extra cost and the suggested upcharge per cup size">
          <THead>
            <tr>
              <SortHeader label="Modifier" sortKey="name" sort={sort} onSort={onSort} />
              <SortHeader label="Kind" sortKey="kind" sort={sort} onSort={onSort} />
              <SortHeader label="Menu upcharge" sortKey="upcharge" sort={sort} onSort={onSort} figure />
              {sizes.map((s) => (
                <Th key={s.id} figure>
                  {s.name}
                  <span className="block text-xs font-normal">extra cost · suggested</span>
                </Th>
              ))}
            </tr>
          </THead>
          <tbody>
            {sorted.map((m) => (
              <tr key={m.id} data-modifier={m.name}>
                <Td>
                  <TextLink to={paths.modifier.href(m.id)}>{m.name}</TextLink>
                </Td>
                <Td>{kindLabels[m.kind]}</Td>
                <Td figure>{m.upcharge === null ? <span className="text-muted">not set</span> : formatMoney(m.upcharge, currency)}</Td>
                {sizes.map((s) => {
                  const x = m.sizes.find((ms) => ms.sizeId === s.id);
                  return (
                    <Td key={s.id} figure data-size={s.name}>
                      {!x ? (
                        <span className="text-muted">not offered</span>
                      ) : x.problem || x.costDelta === null ? (
                        <span className="text-sm text-rose">{x.problem ?? 'Cannot be costed yet.'}</span>
                      ) : (
                        <div className="flex flex-col items-end gap-1">
                          <span>
                            <span data-figure="extra-cost">{formatMoney(x.costDelta, currency, { detail: true })}</span>
                            <span className="text-muted"> · </span>
                            <span data-figure="suggested">{x.suggestedUpcharge === null ? '—' : formatMoney(x.suggestedUpcharge, currency)}</span>
                          </span>
                          <UpchargeMark upcharge={m.upcharge} suggested={x.suggestedUpcharge} />
                        </div>
                      )}
                    </Td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

import { useCallback, useMemo, useState } from 'react';
import { TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { SortHeader, Table, Td, THead, useSortedRows } from '../../../components/ui/table';
import { StatusMark } from '../../../components/ui/status-mark';
import { formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import type { Supplier } from '../../../shared/contract/suppliers';
import { weekdayName } from '../schemas';

type SortKey = 'name' | 'paymentTerms' | 'minimumOrder' | 'leadDays';

export function deliveryDaysText(days: number[]): string {
  return days.length === 0 ? 'No delivery days set' : days.map((d) => weekdayName(d)).join(', ');
}

/** Every supplier with how and when they take orders; each opens its form. */
export function SuppliersTable({ suppliers, currency }: { suppliers: Supplier[]; currency: string }) {
  const [search, setSearch] = useState('');
  const shown = useMemo(() => {
    const q = search.trim().toLowerCase();
    return suppliers.filter((s) => `${s.name} ${s.contactName ?? ''} ${s.orderEmail ?? ''}`.toLowerCase().includes(q));
  }, [suppliers, search]);
  const value = useCallback((s: Supplier, key: SortKey) => s[key], []);
  const { sorted, sort, onSort } = useSortedRows<Supplier, SortKey>(shown, { key: 'name', direction: 'asc' }, value);
  return (
    <div className="flex flex-col gap-4">
      <Field label="Search suppliers" className="max-w-sm">
        <Input type="search" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="Name, contact or e-mail" />
      </Field>
      {sorted.length === 0 ? (
        <EmptyState title="No supplier matches" next="Clear the search, or add the supplier." />
      ) : (
        <Table caption="Suppliers">
          <THead>
            <tr>
              <SortHeader label="Supplier" sortKey="name" sort={sort} onSort={onSort} />
              <th scope="col" className="px-3 py-2 font-medium text-muted">Orders go to</th>
              <SortHeader label="Paid" sortKey="paymentTerms" sort={sort} onSort={onSort} />
              <SortHeader label="Minimum order" sortKey="minimumOrder" sort={sort} onSort={onSort} figure />
              <th scope="col" className="px-3 py-2 font-medium text-muted">Delivers on</th>
              <SortHeader label="Lead time" sortKey="leadDays" sort={sort} onSort={onSort} figure />
            </tr>
          </THead>
          <tbody>
            {sorted.map((s) => (
              <tr key={s.id}>
                <Td>
                  <TextLink to={paths.supplier.href(s.id)}>{s.name}</TextLink>
                  {s.contactName && <span className="block text-xs text-muted">{s.contactName}</span>}
                </Td>
                <Td className="break-all">{s.orderEmail ?? <StatusMark tone="attention">no order e-mail</StatusMark>}</Td>
                <Td>{s.paymentTerms === 'card' ? 'By card when ordering' : 'On account'}</Td>
                <Td figure>{formatMoney(s.minimumOrder, currency)}</Td>
                <Td>
                  {deliveryDaysText(s.deliveryDays)}
                  <span className="block text-xs text-muted">order by {s.orderCutoff}</span>
                </Td>
                <Td figure>{s.leadDays === 1 ? '1 day' : `${s.leadDays} days`}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

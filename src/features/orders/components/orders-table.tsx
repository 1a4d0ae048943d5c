import { useCallback, useMemo, useState } from 'react';
import { TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Select } from '../../../components/ui/input';
import { SortHeader, Table, Td, THead, useSortedRows } from '../../../components/ui/table';
import { formatDate, formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import type { OrderStatus, OrderSummary } from '../api/types';
import { OrderStatusMark, orderStatusLabel } from './order-status';

type SortKey = 'number' | 'supplier' | 'site' | 'status' | 'total' | 'createdAt' | 'expectedOn';
const STATUSES: OrderStatus[] = ['draft', 'placed', 'paid', 'part_received', 'received', 'closed', 'cancelled'];

/** Every purchase order, newest first, filterable by state. */
export function OrdersTable({ orders }: { orders: OrderSummary[] }) {
  const [status, setStatus] = useState('');
  const shown = useMemo(() => orders.filter((o) => !status || o.status === status), [orders, status]);
  const value = useCallback((o: OrderSummary, key: SortKey) => {
    if (key === 'supplier' || key === 'site') return o[key].name;
    if (key === 'total') return o.total;
    if (key === 'status') return STATUSES.indexOf(o.status);
    return o[key];
  }, []);
  const { sorted, sort, onSort } = useSortedRows<OrderSummary, SortKey>(shown, { key: 'createdAt', direction: 'desc' }, value);
  return (
    <div className="flex flex-col gap-4">
      <label className="flex max-w-xs flex-col gap-1 text-sm font-medium text-ink">
        Show
        <Select value={status} onChange={(e) => setStatus(e.target.value)}>
          <option value="">Every order</option>
          {STATUSES.map((s) => <option key={s} value={s}>{orderStatusLabel(s)}</option>)}
        </Select>
      </label>
      {sorted.length === 0 ? (
        <EmptyState title="No order in this state" next="Choose every order to see them all." />
      ) : (
        <Table caption="Purchase orders">
          <THead>
            <tr>
              <SortHeader label="Order" sortKey="number" sort={sort} onSort={onSort} />
              <SortHeader label="Supplier" sortKey="supplier" sort={sort} onSort={onSort} />
              <SortHeader label="Site" sortKey="site" sort={sort} onSort={onSort} />
              <SortHeader label="State" sortKey="status" sort={sort} onSort={onSort} />
              <SortHeader label="Started" sortKey="createdAt" sort={sort} onSort={onSort} />
              <SortHeader label="Expected" sortKey="expectedOn" sort={sort} onSort={onSort} />
              <SortHeader label="Total" sortKey="total" sort={sort} onSort={onSort} figure />
            </tr>
          </THead>
          <tbody>
            {sorted.map((o) => (
              <tr key={o.id}>
                <Td><TextLink to={paths.order.href(o.id)}>{o.number}</TextLink></Td>
                <Td>{o.supplier.name}</Td>
                <Td>{o.site.name}</Td>
                <Td><OrderStatusMark status={o.status} /></Td>
                <Td className="whitespace-nowrap">{formatDate(o.createdAt)}</Td>
                <Td className="whitespace-nowrap">{o.expectedOn ? formatDate(o.expectedOn) : <span className="text-muted">—</span>}</Td>
                <Td figure>{formatMoney(o.total, o.currency)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

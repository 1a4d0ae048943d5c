import { TextLink } from '../../../components/ui/button';
import { DataTable, type DataColumn } from '../../../components/ui/data-table';
import { StatusMark } from '../../../components/ui/status-mark';
import { formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import type { Supplier } from '../../../shared/contract/suppliers';
import { weekdayName } from '../schemas';

export function deliveryDaysText(days: number[]): string {
  return days.length === 0 ? 'No delivery days set' : days.map((d) => weekdayName(d)).join(', ');
}

const columns = (currency: string): DataColumn<Supplier>[] => [
  {
    id: 'name', header: 'Supplier', sortValue: (s) => s.name, searchText: (s) => `${s.name} ${s.contactName ?? ''}`,
    cell: (s) => (
      <>
        <TextLink to={paths.supplier.href(s.id)}>{s.name}</TextLink>
        {s.contactName && <span className="block text-xs text-muted">{s.contactName}</span>}
      </>
    ),
  },
  { id: 'orderEmail', header: 'Orders go to', className: 'break-all', searchText: (s) => s.orderEmail, cell: (s) => s.orderEmail ?? <StatusMark tone="attention">no order e-mail</StatusMark> },
  { id: 'paymentTerms', header: 'Paid', sortValue: (s) => s.paymentTerms, cell: (s) => (s.paymentTerms === 'card' ? 'By card when ordering' : 'On account') },
  { id: 'minimumOrder', header: 'Minimum order', figure: true, sortValue: (s) => s.minimumOrder, cell: (s) => formatMoney(s.minimumOrder, currency) },
  {
    id: 'deliveryDays', header: 'Delivers on',
    cell: (s) => (
      <>
        {deliveryDaysText(s.deliveryDays)}
        <span className="block text-xs text-muted">order by {s.orderCutoff}</span>
      </>
    ),
  },
  { id: 'leadDays', header: 'Lead time', figure: true, sortValue: (s) => s.leadDays, cell: (s) => (s.leadDays === 1 ? '1 day' : `${s.leadDays} days`) },
];

/** Every supplier with how and when they take orders; each opens its form. */
export function SuppliersTable({ suppliers, currency }: { suppliers: Supplier[]; currency: string }) {
  return (
    <DataTable
      caption="Suppliers"
      rows={suppliers}
      columns={columns(currency)}
      rowId={(s) => s.id}
      initialSort={{ id: 'name', direction: 'asc' }}
      search={{ label: 'Search suppliers', placeholder: 'Name, contact or e-mail' }}
      noMatch={{ title: 'No supplier matches', next: 'Clear the search, or add the supplier.' }}
    />
  );
}

import { EmptyState } from '../../../components/ui/empty-state';
import { StatusMark } from '../../../components/ui/status-mark';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { formatDate, formatMoney, formatQuantity } from '../../../lib/format';
import type { SalesDay } from '../api/sales-days';
import type { SalesImport } from '../api/types';

const STATUS = { accepted: { tone: 'good', label: 'Accepted' }, pending: { tone: 'attention', label: 'Not accepted' }, discarded: { tone: 'neutral', label: 'Discarded' } } as const;

/** The site's till files, newest first. */
export function ImportsList({ imports }: { imports: SalesImport[] }) {
  const shown = imports.filter((i) => i.status !== 'discarded');
  if (shown.length === 0) return <EmptyState title="No till files yet" next="Export the day's or the month's sales from the till as CSV and upload it above." />;
  return (
    <Table caption="Till files">
      <THead>
        <tr>
          <Th>File</Th>
          <Th>Days</Th>
          <Th figure>Lines</Th>
          <Th>Status</Th>
        </tr>
      </THead>
      <tbody>
        {shown.map((i) => (
          <tr key={i.id}>
            <Td className="break-all">{i.filename}</Td>
            <Td className="whitespace-nowrap">{i.firstDay ? `${formatDate(i.firstDay)}${i.lastDay && i.lastDay !== i.firstDay ? ` – ${formatDate(i.lastDay)}` : ''}` : '—'}</Td>
            <Td figure>{i.rowCount}</Td>
            <Td>
              <StatusMark tone={STATUS[i.status].tone}>{STATUS[i.status].label}</StatusMark>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

/** Cups and net sales per day of the month, imported and hand-entered. */
export function SalesDaysTable({ days, currency }: { days: SalesDay[]; currency: string }) {
  if (days.length === 0) return <EmptyState title="No sales this month yet" next="Upload the till's file, or enter a day's sales by hand below." />;
  return (
    <Table caption="Sales by day">
      <THead>
        <tr>
          <Th>Day</Th>
          <Th figure>Cups</Th>
          <Th figure>Net sales</Th>
          <Th>From</Th>
        </tr>
      </THead>
      <tbody>
        {days.map((d) => (
          <tr key={d.day} data-day={d.day}>
            <Td className="whitespace-nowrap">{formatDate(d.day)}</Td>
            <Td figure>{formatQuantity(d.cups)}</Td>
            <Td figure>{formatMoney(d.netSales, currency)}</Td>
            <Td className="text-muted">{[d.importedLines ? 'till file' : null, d.manualLines ? 'by hand' : null].filter(Boolean).join(' and ')}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

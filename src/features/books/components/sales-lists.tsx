import { useCallback, useMemo, useState } from 'react';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Select } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, TableFilters, TableSearch, Td, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import { formatDate, formatMoney, formatQuantity } from '../../../lib/format';
import type { SalesDay, SalesImport } from '../../../shared/contract/books';

const STATUS = { accepted: { tone: 'good', label: 'Accepted' }, pending: { tone: 'attention', label: 'Not accepted' }, discarded: { tone: 'neutral', label: 'Discarded' } } as const;

type ImportKey = 'filename' | 'firstDay' | 'rowCount' | 'status';

/** The site's till files, newest first. */
export function ImportsList({ imports }: { imports: SalesImport[] }) {
  const [search, setSearch] = useState('');
  const [status, setStatus] = useState('');
  const kept = useMemo(() => imports.filter((i) => i.status !== 'discarded'), [imports]);
  const shown = useMemo(() => kept.filter((i) => (!status || i.status === status) && matchesSearch(search, i.filename)), [kept, search, status]);
  const value = useCallback((i: SalesImport, key: ImportKey) => (key === 'status' ? STATUS[i.status].label : i[key]), []);
  const { sorted, sort, onSort } = useSortedRows<SalesImport, ImportKey>(shown, null, value);
  if (kept.length === 0) return <EmptyState title="No till files yet" next="Export the day's or the month's sales from the till as CSV and upload it above." />;
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={kept.length}>
        <TableSearch label="Search till files" value={search} onChange={setSearch} placeholder="File name" />
        <Field label="Status" className="w-48">
          <Select value={status} onChange={(e) => setStatus(e.target.value)}>
            <option value="">Every file</option>
            <option value="accepted">{STATUS.accepted.label}</option>
            <option value="pending">{STATUS.pending.label}</option>
          </Select>
        </Field>
      </TableFilters>
      {sorted.length === 0 ? (
        <EmptyState title="No till file matches" next="Clear the search or choose every file." />
      ) : (
        <Table caption="Till files">
          <THead>
            <tr>
              <SortHeader label="File" sortKey="filename" sort={sort} onSort={onSort} />
              <SortHeader label="Days" sortKey="firstDay" sort={sort} onSort={onSort} />
              <SortHeader label="Lines" sortKey="rowCount" sort={sort} onSort={onSort} figure />
              <SortHeader label="Status" sortKey="status" sort={sort} onSort={onSort} />
            </tr>
          </THead>
          <tbody>
            {sorted.map((i) => (
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
      )}
    </div>
  );
}

type DayKey = 'day' | 'cups' | 'netSales' | 'from';
type From = '' | 'till' | 'hand';

const fromText = (d: SalesDay) => [d.importedLines ? 'till file' : null, d.manualLines ? 'by hand' : null].filter(Boolean).join(' and ');

/** Cups and net sales per day of the month, imported and hand-entered. */
export function SalesDaysTable({ days, currency }: { days: SalesDay[]; currency: string }) {
  const [from, setFrom] = useState<From>('');
  const shown = useMemo(() => days.filter((d) => !from || (from === 'till' ? d.importedLines > 0 : d.manualLines > 0)), [days, from]);
  const value = useCallback((d: SalesDay, key: DayKey) => (key === 'from' ? fromText(d) : d[key]), []);
  const { sorted, sort, onSort } = useSortedRows<SalesDay, DayKey>(shown, null, value);
  if (days.length === 0) return <EmptyState title="No sales this month yet" next="Upload the till's file, or enter a day's sales by hand below." />;
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={days.length}>
        <Field label="Days with sales" className="w-56">
          <Select value={from} onChange={(e) => setFrom(e.target.value as From)}>
            <option value="">From anywhere</option>
            <option value="till">From a till file</option>
            <option value="hand">Entered by hand</option>
          </Select>
        </Field>
      </TableFilters>
      {sorted.length === 0 ? (
        <EmptyState title={from === 'till' ? 'No day has sales from a till file' : 'No day has sales entered by hand'} next="Choose days from anywhere to see them all." />
      ) : (
        <Table caption="Sales by day">
          <THead>
            <tr>
              <SortHeader label="Day" sortKey="day" sort={sort} onSort={onSort} />
              <SortHeader label="Cups" sortKey="cups" sort={sort} onSort={onSort} figure />
              <SortHeader label="Net sales" sortKey="netSales" sort={sort} onSort={onSort} figure />
              <SortHeader label="From" sortKey="from" sort={sort} onSort={onSort} />
            </tr>
          </THead>
          <tbody>
            {sorted.map((d) => (
              <tr key={d.day} data-day={d.day}>
                <Td className="whitespace-nowrap">{formatDate(d.day)}</Td>
                <Td figure>{formatQuantity(d.cups)}</Td>
                <Td figure>{formatMoney(d.netSales, currency)}</Td>
                <Td className="text-muted">{fromText(d)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </div>
  );
}

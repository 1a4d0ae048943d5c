import { useCallback, useMemo, useState } from 'react';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Select } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, TableFilters, Td, THead, useSortedRows } from '../../../components/ui/table';
import { formatMoney } from '../../../lib/format';
import { dec } from '../../../shared/decimal';
import type { CogsReport, CogsRow } from '../../../shared/contract/books';

const CATEGORY_NAMES: Record<string, string> = {
  coffee: 'Coffee', dairy: 'Dairy', 'plant-milk': 'Plant milk', 'syrup-sauce': 'Syrups and sauces', powder: 'Powders', tea: 'Tea', extras: 'Extras', packaging: 'Packaging', other: 'Other',
};
export const categoryName = (c: string) => CATEGORY_NAMES[c] ?? c;

const pct = (v: string | null) => (v === null ? '—' : `${v} %`);

/** Over or under theoretical, in words as well as colour. */
function VarianceMark({ variance }: { variance: string }) {
  const sign = dec(variance).cmp(0);
  if (sign === 0) return null;
  return <StatusMark tone={sign > 0 ? 'bad' : 'good'}>{sign > 0 ? 'over' : 'under'}</StatusMark>;
}

type SortKey = keyof CogsRow;
type Show = '' | 'over' | 'under';

const COLUMNS: { key: Exclude<SortKey, 'category'>; label: string }[] = [
  { key: 'opening', label: 'Opening stock' },
  { key: 'purchases', label: 'Purchases' },
  { key: 'closing', label: 'Closing stock' },
  { key: 'actual', label: 'Actual cost' },
  { key: 'theoretical', label: 'Theoretical cost' },
  { key: 'variance', label: 'Variance' },
  { key: 'variancePct', label: 'Variance %' },
  { key: 'waste', label: 'Waste at cost' },
];

/** The month's cost of goods by ingredient category, with the totals row the CSV also ends with. */
export function CogsTable({ report }: { report: CogsReport }) {
  const m = (v: string) => formatMoney(v, report.currency);
  const t = report.totals;
  const [show, setShow] = useState<Show>('');
  const shown = useMemo(() => report.rows.filter((r) => !show || dec(r.variance).cmp(0) === (show === 'over' ? 1 : -1)), [report.rows, show]);
  const value = useCallback((r: CogsRow, key: SortKey) => (key === 'category' ? categoryName(r.category) : r[key]), []);
  const { sorted, sort, onSort } = useSortedRows<CogsRow, SortKey>(shown, null, value);
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={report.rows.length}>
        <Field label="Show categories" className="w-64">
          <Select value={show} onChange={(e) => setShow(e.target.value as Show)}>
            <option value="">Every category</option>
            <option value="over">Over theoretical cost</option>
            <option value="under">Under theoretical cost</option>
          </Select>
        </Field>
      </TableFilters>
      <Table caption="Cost of goods by ingredient category">
        <THead>
          <tr>
            <SortHeader label="Category" sortKey="category" sort={sort} onSort={onSort} />
            {COLUMNS.map((c) => (
              <SortHeader key={c.key} label={c.label} sortKey={c.key} sort={sort} onSort={onSort} figure />
            ))}
          </tr>
        </THead>
        <tbody>
          {sorted.map((r) => (
            <tr key={r.category} data-category={r.category}>
              <Td>{categoryName(r.category)}</Td>
              <Td figure>{m(r.opening)}</Td>
              <Td figure>{m(r.purchases)}</Td>
              <Td figure>{m(r.closing)}</Td>
              <Td figure>{m(r.actual)}</Td>
              <Td figure>{m(r.theoretical)}</Td>
              <Td figure>
                <span className="inline-flex items-center gap-2">
                  <VarianceMark variance={r.variance} />
                  {m(r.variance)}
                </span>
              </Td>
              <Td figure>{pct(r.variancePct)}</Td>
              <Td figure>{m(r.waste)}</Td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="font-bold" data-testid="cogs-totals">
            <Td>All categories</Td>
            <Td figure data-figure="opening">{m(t.opening)}</Td>
            <Td figure data-figure="purchases">{m(t.purchases)}</Td>
            <Td figure data-figure="closing">{m(t.closing)}</Td>
            <Td figure data-figure="actual">{m(t.actual)}</Td>
            <Td figure data-figure="theoretical">{m(t.theoretical)}</Td>
            <Td figure data-figure="variance">{m(t.variance)}</Td>
            <Td figure>{pct(t.variancePct)}</Td>
            <Td figure data-figure="waste">{m(t.waste)}</Td>
          </tr>
        </tfoot>
      </Table>
      {sorted.length === 0 && <EmptyState title={`No category is ${show} theoretical cost`} next="Choose every category to see them all." />}
    </div>
  );
}

/** The month's headline figures. */
export function CogsSummary({ report }: { report: CogsReport }) {
  const items = [
    { label: 'Net sales', value: formatMoney(report.totals.netSales, report.currency), key: 'netSales' },
    { label: 'Cost of goods (actual)', value: formatMoney(report.totals.actual, report.currency), key: 'actual' },
    { label: 'Cost of goods % of net sales', value: pct(report.totals.cogsPctOfSales), key: 'cogsPctOfSales' },
    { label: 'Variance against theoretical', value: `${formatMoney(report.totals.variance, report.currency)} (${pct(report.totals.variancePct)})`, key: 'variance' },
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 md:grid-cols-4">
      {items.map((i) => (
        <div key={i.key} className="rounded-lg border border-rule bg-card p-4">
          <dt className="text-sm text-muted">{i.label}</dt>
          <dd className="mt-1 text-xl font-bold tabular-nums" data-summary={i.key}>
            {i.value}
          </dd>
        </div>
      ))}
    </dl>
  );
}

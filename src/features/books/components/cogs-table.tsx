import { StatusMark } from '../../../components/ui/status-mark';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { formatMoney } from '../../../lib/format';
import type { CogsReport } from '../api/types';

const CATEGORY_NAMES: Record<string, string> = {
  coffee: 'Coffee', dairy: 'Dairy', 'plant-milk': 'Plant milk', 'syrup-sauce': 'Syrups and sauces', powder: 'Powders', tea: 'Tea', extras: 'Extras', packaging: 'Packaging', other: 'Other',
};
export const categoryName = (c: string) => CATEGORY_NAMES[c] ?? c;

const pct = (v: string | null) => (v === null ? '—' : `${v} %`);

/** Over or under theoretical, in words as well as colour. */
function VarianceMark({ variance }: { variance: string }) {
  const n = Number(variance);
  if (n === 0) return null;
  return <StatusMark tone={n > 0 ? 'bad' : 'good'}>{n > 0 ? 'over' : 'under'}</StatusMark>;
}

/** The month's cost of goods by ingredient category, with the totals row the CSV also ends with. */
export function CogsTable({ report }: { report: CogsReport }) {
  const m = (v: string) => formatMoney(v, report.currency);
  const t = report.totals;
  return (
    <Table caption="Cost of goods by ingredient category">
      <THead>
        <tr>
          <Th>Category</Th>
          <Th figure>Opening stock</Th>
          <Th figure>Purchases</Th>
          <Th figure>Closing stock</Th>
          <Th figure>Actual cost</Th>
          <Th figure>Theoretical cost</Th>
          <Th figure>Variance</Th>
          <Th figure>Variance %</Th>
          <Th figure>Waste at cost</Th>
        </tr>
      </THead>
      <tbody>
        {report.rows.map((r) => (
          <tr key={r.category}>
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

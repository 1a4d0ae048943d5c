import { Bar, BarChart, CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { ErrorState } from '../../../components/ui/error-state';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { formatMoney } from '../../../lib/format';
import { useCogsTrend, useSupplierPurchases } from '../api/reports';
import type { CogsReport } from '../../../shared/contract/books';
import { categoryName } from './cogs-table';

// Recharts draws with currentColor under the palette's text colours (tailwind.config.ts), so no
// colour is written here. The charts are pictures of figures also given as text beside them, so
// they are hidden from screen readers and kept out of the tab order (no accessibility layer:
// a focusable chart inside an aria-hidden box would be a stop that reads as nothing).
const axis = { tick: { fill: 'currentColor', fontSize: 12 }, stroke: 'currentColor' };
const monthName = (m: string) => new Date(`${m}-01T12:00:00Z`).toLocaleDateString(undefined, { month: 'short', year: '2-digit', timeZone: 'UTC' });

/** The series' names beside a swatch of their colour (Recharts' own legend would draw every swatch in the box's grey). */
function SeriesKey({ series }: { series: { name: string; swatch: string }[] }) {
  return (
    <ul className="flex flex-wrap gap-4 text-sm text-ink" aria-label="Series">
      {series.map((s) => (
        <li key={s.name} className="flex items-center gap-2">
          <span aria-hidden="true" className={`inline-block h-3 w-3 rounded-sm ${s.swatch}`} />
          {s.name}
        </li>
      ))}
    </ul>
  );
}

function ChartFigure({ title, children, summary, series }: { title: string; children: React.ReactNode; summary: React.ReactNode; series?: { name: string; swatch: string }[] }) {
  return (
    <figure className="flex flex-col gap-2 rounded-lg border border-rule bg-card p-4">
      <figcaption className="font-medium">{title}</figcaption>
      {series && <SeriesKey series={series} />}
      <div className="h-56 w-full text-muted" aria-hidden="true">
        {children}
      </div>
      <div className="text-sm text-muted">{summary}</div>
    </figure>
  );
}

export function CogsTrendChart({ month, siteId }: { month: string; siteId: string | null }) {
  const q = useCogsTrend(month, siteId);
  if (q.isPending) return <SkeletonRows rows={3} label="Loading the months" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const data = q.data.months.map((m) => ({ month: monthName(m.month), pct: m.cogsPctOfSales === null ? null : Number(m.cogsPctOfSales), label: m.cogsPctOfSales }));
  return (
    <ChartFigure
      title="Cost of goods as % of net sales, by month"
      summary={
        <ul className="flex flex-wrap gap-x-4">
          {q.data.months.map((m) => (
            <li key={m.month}>
              {monthName(m.month)}: <span className="tabular-nums">{m.cogsPctOfSales === null ? 'no sales' : `${m.cogsPctOfSales} %`}</span>
            </li>
          ))}
        </ul>
      }
    >
      <ResponsiveContainer width="100%" height="100%">
        <LineChart accessibilityLayer={false} data={data} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
          <CartesianGrid stroke="currentColor" strokeOpacity={0.15} strokeDasharray="3 3" />
          <XAxis dataKey="month" {...axis} />
          <YAxis width={40} unit="%" {...axis} />
          <Tooltip formatter={(v) => `${v} %`} />
          <Line dataKey="pct" name="Cost of goods %" className="text-slate" stroke="currentColor" strokeWidth={2} dot={{ r: 3, fill: 'currentColor' }} connectNulls isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

export function SupplierChart({ month, siteId, currency }: { month: string; siteId: string | null; currency: string }) {
  const q = useSupplierPurchases(month, siteId);
  if (q.isPending) return <SkeletonRows rows={3} label="Loading purchases" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const data = q.data.suppliers.map((s) => ({ supplier: s.supplier, net: Number(s.net) }));
  return (
    <ChartFigure
      title="Purchases by supplier (net of purchase tax)"
      summary={q.data.suppliers.length ? q.data.suppliers.map((s) => `${s.supplier} ${formatMoney(s.net, currency)}`).join(' · ') : 'No deliveries received this month.'}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart accessibilityLayer={false} data={data} layout="vertical" margin={{ top: 8, right: 16, bottom: 8, left: 8 }}>
          <CartesianGrid stroke="currentColor" strokeOpacity={0.15} strokeDasharray="3 3" />
          <XAxis type="number" {...axis} />
          <YAxis type="category" dataKey="supplier" width={120} {...axis} />
          <Tooltip formatter={(v) => formatMoney(String(v), currency)} />
          <Bar dataKey="net" name="Net purchases" className="text-copper" fill="currentColor" isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

export function CategoryChart({ report }: { report: CogsReport }) {
  const data = report.rows.map((r) => ({ category: categoryName(r.category), actual: Number(r.actual), theoretical: Number(r.theoretical) }));
  return (
    <ChartFigure
      title="Actual against theoretical cost, by category"
      summary="The figures are in the table above."
      series={[
        { name: 'Actual', swatch: 'bg-slate' },
        { name: 'Theoretical', swatch: 'bg-butter' },
      ]}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart accessibilityLayer={false} data={data} margin={{ top: 8, right: 16, bottom: 8, left: 0 }}>
          <CartesianGrid stroke="currentColor" strokeOpacity={0.15} strokeDasharray="3 3" />
          <XAxis dataKey="category" {...axis} interval={0} angle={-20} textAnchor="end" height={50} />
          <YAxis width={56} {...axis} />
          <Tooltip formatter={(v) => formatMoney(String(v), report.currency)} />
          <Bar dataKey="actual" name="Actual" className="text-slate" fill="currentColor" isAnimationActive={false} />
          <Bar dataKey="theoretical" name="Theoretical" className="text-butter" fill="currentColor" isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

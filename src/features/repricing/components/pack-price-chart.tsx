import { CartesianGrid, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { ErrorState } from '../../../components/ui/error-state';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { formatDate, formatMoney } from '../../../lib/format';
import { usePackPrices } from '../api/pack-prices';

/**
 * A pack's price over time as a step line (a price holds until the next one takes effect),
 * with the list beside it so the figures are readable without the chart.
 */
export function PackPriceChart({ packId, title, currency, today }: { packId: string; title: string; currency: string; today: string }) {
  const q = usePackPrices(packId);
  if (q.isPending) return <SkeletonRows rows={3} label="Loading the price history" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const points = [...q.data.prices].reverse();
  // Recharts plots numbers; the chart is a picture only, the figures shown are the strings.
  const data = points.map((p) => ({ date: p.effectiveFrom, price: Number(p.price), label: p.price }));
  return (
    <figure className="flex flex-col gap-3">
      <figcaption className="font-medium">Price history: {title}</figcaption>
      <div className="h-56 w-full text-muted" aria-hidden="true">
        <ResponsiveContainer width="100%" height="100%">
          {/* A picture only (aria-hidden above), so no accessibility layer to put it in the tab order. */}
          <LineChart accessibilityLayer={false} data={data} margin={{ top: 8, right: 16, bottom: 8, left: 8 }}>
            <CartesianGrid stroke="currentColor" strokeOpacity={0.15} strokeDasharray="3 3" />
            <XAxis dataKey="date" tickFormatter={(d: string) => formatDate(d)} tick={{ fill: 'currentColor', fontSize: 12 }} stroke="currentColor" />
            <YAxis width={56} domain={['auto', 'auto']} tick={{ fill: 'currentColor', fontSize: 12 }} stroke="currentColor" />
            <Tooltip formatter={(_v, _n, item) => formatMoney((item.payload as { label: string }).label, currency)} labelFormatter={(d) => formatDate(String(d))} />
            <Line type="stepAfter" dataKey="price" className="text-slate" stroke="currentColor" strokeWidth={2} dot={{ r: 3, fill: 'currentColor' }} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <ul className="text-sm">
        {q.data.prices.map((p) => (
          <li key={p.id} className="flex justify-between gap-4 border-t border-rule py-1">
            <span>
              from {formatDate(p.effectiveFrom)}
              {p.effectiveFrom > today && <span className="ml-2 font-medium">(planned)</span>}
              {p.note && <span className="ml-2 text-muted">{p.note}</span>}
            </span>
            <span className="tabular-nums">{formatMoney(p.price, currency)}</span>
          </li>
        ))}
      </ul>
    </figure>
  );
}

import { useCallback, useMemo, useState } from 'react';
import { Bar, BarChart, CartesianGrid, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { TextLink } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Input, Select } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { SortHeader, Table, Td, THead, useSortedRows, type SortValue } from '../../../components/ui/table';
import { formatDate, formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { dec } from '../../../shared/decimal';
import type { MenuCosting } from '../../../shared/contract/costing';
import { formatPct } from './size-figures';

interface Row {
  key: string;
  drinkId: string;
  drink: string;
  category: string;
  size: string;
  cost: string | null;
  currentPrice: string | null;
  marginPct: string | null;
  suggestedPrice: string | null;
  targetMarginPct: string;
  belowTarget: boolean;
  problem: string | null;
}
type SortKey = 'drink' | 'category' | 'size' | 'cost' | 'currentPrice' | 'marginPct' | 'suggestedPrice' | 'status';

// Chart series in the product's order: slate, copper, butter, olive, then greys. Bars are
// filled with currentColor under these text colours, so the palette stays in tailwind.config.ts.
const SERIES = [
  { text: 'text-slate', swatch: 'bg-slate' },
  { text: 'text-copper', swatch: 'bg-copper' },
  { text: 'text-butter', swatch: 'bg-butter' },
  { text: 'text-olive', swatch: 'bg-olive' },
  { text: 'text-muted', swatch: 'bg-muted' },
  { text: 'text-rule', swatch: 'bg-rule' },
];

function statusOf(r: Row): { rank: number; label: string } {
  if (r.problem) return { rank: 0, label: 'cannot be costed' };
  if (r.belowTarget) return { rank: 1, label: 'below target' };
  if (r.marginPct === null) return { rank: 2, label: 'no price' };
  return { rank: 3, label: 'on target' };
}

/** Every drink × cup size: cost, price, margin and suggested price, with those under target marked. */
export function MenuCostingView({ data }: { data: MenuCosting }) {
  const rows = useMemo<Row[]>(
    () =>
      data.drinks.flatMap((d) =>
        d.sizes.map((s) => ({
          key: s.drinkSizeId,
          drinkId: d.id,
          drink: d.name,
          category: d.category,
          size: s.name,
          cost: s.cost,
          currentPrice: s.currentPrice,
          marginPct: s.marginPct,
          suggestedPrice: s.suggestedPrice,
          targetMarginPct: d.targetMarginPct,
          belowTarget: s.belowTarget,
          problem: s.problem,
        })),
      ),
    [data],
  );
  const categories = useMemo(() => [...new Set(rows.map((r) => r.category))].sort(), [rows]);
  const [search, setSearch] = useState('');
  const [category, setCategory] = useState('');
  const [onlyBelow, setOnlyBelow] = useState(false);
  const filtered = useMemo(
    () =>
      rows.filter(
        (r) =>
          (!search.trim() || r.drink.toLowerCase().includes(search.trim().toLowerCase())) &&
          (!category || r.category === category) &&
          (!onlyBelow || r.belowTarget),
      ),
    [rows, search, category, onlyBelow],
  );
  const value = useCallback((r: Row, key: SortKey): SortValue => {
    switch (key) {
      case 'cost':
      case 'currentPrice':
      case 'marginPct':
      case 'suggestedPrice':
        return r[key];
      case 'status':
        return statusOf(r).rank;
      default:
        return r[key];
    }
  }, []);
  const { sorted, sort, onSort } = useSortedRows<Row, SortKey>(filtered, { key: 'drink', direction: 'asc' }, value);
  const belowCount = rows.filter((r) => r.belowTarget).length;
  const { currency } = data;

  return (
    <div className="flex flex-col gap-6">
      <p className="text-muted">
        Costed with the prices in force on {formatDate(data.asOf)}.{' '}
        {belowCount > 0 ? (
          <span className="font-medium text-ink">
            {belowCount} {belowCount === 1 ? 'cup size is' : 'cup sizes are'} below the target margin.
          </span>
        ) : (
          'Every priced cup size meets its target margin.'
        )}
      </p>
      <MarginChart data={data} />
      <div className="flex flex-wrap items-end gap-4">
        <Field label="Search drinks" className="w-64">
          <Input type="search" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="Drink name" />
        </Field>
        <Field label="Category" className="w-56">
          <Select value={category} onChange={(e) => setCategory(e.target.value)}>
            <option value="">All categories</option>
            {categories.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </Select>
        </Field>
        <label className="flex items-center gap-2 pb-2 text-ink">
          <input type="checkbox" className="h-4 w-4 accent-copper" checked={onlyBelow} onChange={(e) => setOnlyBelow(e.target.checked)} />
          Only below target
        </label>
      </div>
      {sorted.length === 0 ? (
        <EmptyState title="Nothing matches these filters" next="Clear the search or choose all categories." />
      ) : (
        <Table caption="Menu costing by drink and cup size">
          <THead>
            <tr>
              <SortHeader label="Drink" sortKey="drink" sort={sort} onSort={onSort} />
              <SortHeader label="Category" sortKey="category" sort={sort} onSort={onSort} />
              <SortHeader label="Size" sortKey="size" sort={sort} onSort={onSort} />
              <SortHeader label="Cost per cup" sortKey="cost" sort={sort} onSort={onSort} figure />
              <SortHeader label="Menu price" sortKey="currentPrice" sort={sort} onSort={onSort} figure />
              <SortHeader label="Margin" sortKey="marginPct" sort={sort} onSort={onSort} figure />
              <SortHeader label="Suggested price" sortKey="suggestedPrice" sort={sort} onSort={onSort} figure />
              <SortHeader label="Against target" sortKey="status" sort={sort} onSort={onSort} />
            </tr>
          </THead>
          <tbody>
            {sorted.map((r) => {
              const status = statusOf(r);
              return (
                <tr key={r.key} data-row={`${r.drink} · ${r.size}`} className={r.belowTarget ? 'bg-rose/5' : undefined}>
                  <Td>
                    <TextLink to={paths.drink.href(r.drinkId)}>{r.drink}</TextLink>
                  </Td>
                  <Td>{r.category}</Td>
                  <Td>{r.size}</Td>
                  <Td figure data-col="cost">{r.cost ? formatMoney(r.cost, currency) : '—'}</Td>
                  <Td figure data-col="price">{r.currentPrice ? formatMoney(r.currentPrice, currency) : '—'}</Td>
                  <Td figure data-col="margin">{formatPct(r.marginPct)}</Td>
                  <Td figure data-col="suggested">{r.suggestedPrice ? formatMoney(r.suggestedPrice, currency) : '—'}</Td>
                  <Td>
                    {status.rank === 0 ? (
                      <span title={r.problem ?? undefined}>
                        <StatusMark tone="attention">cannot be costed</StatusMark>
                      </span>
                    ) : status.rank === 1 ? (
                      <StatusMark tone="bad">below target ({r.targetMarginPct} %)</StatusMark>
                    ) : status.rank === 2 ? (
                      <StatusMark tone="neutral">no price</StatusMark>
                    ) : (
                      <StatusMark tone="good">on target</StatusMark>
                    )}
                  </Td>
                </tr>
              );
            })}
          </tbody>
        </Table>
      )}
    </div>
  );
}

/** Margin at the menu price by drink, one bar per cup size, with the target as a line. */
function MarginChart({ data }: { data: MenuCosting }) {
  const sizeNames = [...new Set(data.drinks.flatMap((d) => d.sizes.map((s) => s.name)))];
  // Chart geometry only: the figures shown in words stay the server's strings.
  const points = data.drinks
    .filter((d) => d.sizes.some((s) => s.marginPct !== null))
    .map((d) => ({ drink: d.name, ...Object.fromEntries(d.sizes.filter((s) => s.marginPct !== null).map((s) => [s.name, dec(s.marginPct!).toNumber()])) }));
  const targets = [...new Set(data.drinks.map((d) => d.targetMarginPct))];
  if (points.length === 0) return null;
  const animate = typeof navigator === 'undefined' || !navigator.webdriver;
  return (
    <figure className="rounded-lg border border-rule bg-card p-4 print:hidden">
      <figcaption className="mb-2 font-bold text-ink">
        Margin at the menu price, by drink
      </figcaption>
      <ul className="mb-2 flex flex-wrap gap-4 text-sm text-ink" aria-label="Cup sizes">
        {sizeNames.map((name, i) => (
          <li key={name} className="flex items-center gap-2">
            <span aria-hidden="true" className={`inline-block h-3 w-3 rounded-sm ${SERIES[i % SERIES.length].swatch}`} />
            {name}
          </li>
        ))}
        {targets.length === 1 && (
          <li className="flex items-center gap-2">
            <span aria-hidden="true" className="inline-block h-0 w-4 border-t-2 border-dashed border-rose" />
            target {targets[0]} %
          </li>
        )}
      </ul>
      <div className="text-ink" style={{ height: Math.max(240, points.length * 34 + 60) }}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={points} layout="vertical" margin={{ left: 8, right: 24, top: 8, bottom: 4 }}>
            <CartesianGrid horizontal={false} stroke="currentColor" strokeOpacity={0.15} />
            <XAxis type="number" domain={[0, 100]} unit=" %" tick={{ fill: 'currentColor', fontSize: 12 }} stroke="currentColor" />
            <YAxis type="category" dataKey="drink" width={170} tick={{ fill: 'currentColor', fontSize: 12 }} interval={0} stroke="currentColor" />
            <Tooltip formatter={(v) => `${v} %`} cursor={{ fillOpacity: 0.08 }} />
            {targets.length === 1 && <ReferenceLine x={Number(targets[0])} className="text-rose" stroke="currentColor" strokeWidth={2} strokeDasharray="4 3" />}
            {sizeNames.map((name, i) => (
              <Bar key={name} dataKey={name} className={SERIES[i % SERIES.length].text} fill="currentColor" isAnimationActive={animate} barSize={8} />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

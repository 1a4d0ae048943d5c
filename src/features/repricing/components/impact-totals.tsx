import { formatDate } from '../../../lib/format';
import type { Impact } from '../api/types';
import { Money } from './figures';

/** The impact in a few sentences: how many sizes, how many fall below target, the money a week and a month. */
export function ImpactTotals({ impact }: { impact: Impact }) {
  const t = impact.totals;
  const c = impact.currency;
  return (
    <dl className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
      <div className="rounded-lg border border-rule bg-card p-4">
        <dt className="text-sm text-muted">Drink sizes affected</dt>
        <dd className="text-2xl font-bold tabular-nums">{t.rows}</dd>
        <dd className="text-sm">{t.drinks} drinks</dd>
      </div>
      <div className="rounded-lg border border-rule bg-card p-4">
        <dt className="text-sm text-muted">Below target at today&apos;s prices</dt>
        <dd className="text-2xl font-bold tabular-nums">{t.belowTarget}</dd>
        <dd className="text-sm">{t.wasBelowTarget} before the change; {t.belowTargetAtNewPrices} at the new prices</dd>
      </div>
      <div className="rounded-lg border border-rule bg-card p-4">
        <dt className="text-sm text-muted">Extra cost at the weekly mix</dt>
        <dd className="text-2xl font-bold tabular-nums"><Money value={t.weeklyCostIncrease} currency={c} /> a week</dd>
        <dd className="text-sm"><Money value={t.monthlyCostIncrease} currency={c} /> a month; {t.rowsWithoutCups ? `${t.rowsWithoutCups} sizes have no sales or expected cups yet` : 'every size has a weekly mix'}</dd>
      </div>
      <div className="rounded-lg border border-rule bg-card p-4">
        <dt className="text-sm text-muted">Profit change with the new prices</dt>
        <dd className="text-2xl font-bold tabular-nums"><Money value={t.weeklyProfitChange} currency={c} /> a week</dd>
        <dd className="text-sm"><Money value={t.monthlyProfitChange} currency={c} /> a month; sales from {formatDate(t.salesFrom)} to {formatDate(t.salesTo)}</dd>
      </div>
    </dl>
  );
}

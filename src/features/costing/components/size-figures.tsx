import type { ReactNode } from 'react';
import { StatusMark } from '../../../components/ui/status-mark';
import { formatMoney } from '../../../lib/format';
import { dec } from '../../../shared/decimal';
import type { PriceFigures } from '../../../shared/pricing';

/** "72.06 %" from a percentage written to 2 places. */
export function formatPct(pct: string | null): string {
  return pct === null ? '—' : `${pct} %`;
}

/** Whether a margin is under the target; words and colour together. */
export function MarginMark({ marginPct, targetPct, belowTarget }: { marginPct: string | null; targetPct: string; belowTarget?: boolean }) {
  if (marginPct === null) return <StatusMark tone="neutral">no price</StatusMark>;
  const below = belowTarget ?? dec(marginPct).lt(dec(targetPct));
  return below ? <StatusMark tone="bad">below target</StatusMark> : <StatusMark tone="good">on target</StatusMark>;
}

/**
 * A status mark at the foot of a list of figures, right-aligned. A <dl> may hold only term and
 * value groups, so the mark is a value whose term only screen readers hear.
 */
export function FigureMark({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex justify-end py-1.5">
      <dt className="sr-only">{term}</dt>
      <dd>{children}</dd>
    </div>
  );
}

/** A size's cost, suggested price and margins, as the preview or the saved costing gives them. */
export function SizeFigures({ cost, suggestedPrice, atSuggested, atCurrent, currency, targetPct, testId }: {
  cost: string;
  suggestedPrice: string;
  atSuggested: PriceFigures;
  atCurrent: PriceFigures | null;
  currency: string;
  targetPct: string;
  testId?: string;
}) {
  const row = 'flex items-baseline justify-between gap-3 py-1';
  const fig = 'text-right font-medium tabular-nums text-ink';
  return (
    <dl className="divide-y divide-rule text-sm" data-testid={testId}>
      <div className={row}>
        <dt className="text-muted">Cost per cup</dt>
        <dd className={`${fig} text-base font-bold`} data-figure="cost" data-value={cost}>
          {formatMoney(cost, currency)}
        </dd>
      </div>
      <div className={row}>
        <dt className="text-muted">Cost, in detail</dt>
        <dd className={fig} data-figure="cost-detail">
          {formatMoney(cost, currency, { detail: true })}
        </dd>
      </div>
      <div className={row}>
        <dt className="text-muted">Suggested price</dt>
        <dd className={`${fig} text-base font-bold`} data-figure="suggested" data-value={suggestedPrice}>
          {formatMoney(suggestedPrice, currency)}
        </dd>
      </div>
      <div className={row}>
        <dt className="text-muted">Margin at suggested</dt>
        <dd className={fig} data-figure="margin-suggested">
          {formatPct(atSuggested.marginPct)}
        </dd>
      </div>
      <div className={row}>
        <dt className="text-muted">Profit per cup at suggested</dt>
        <dd className={fig}>{formatMoney(atSuggested.profit, currency)}</dd>
      </div>
      {atCurrent ? (
        <>
          <div className={row}>
            <dt className="text-muted">Margin at menu price</dt>
            <dd className={fig} data-figure="margin-current" data-value={atCurrent.marginPct ?? ''}>
              {formatPct(atCurrent.marginPct)}
            </dd>
          </div>
          <div className={row}>
            <dt className="text-muted">Profit per cup at menu price</dt>
            <dd className={fig}>{formatMoney(atCurrent.profit, currency)}</dd>
          </div>
          <FigureMark term="Against the target margin">
            <MarginMark marginPct={atCurrent.marginPct} targetPct={targetPct} />
          </FigureMark>
        </>
      ) : (
        <div className={row}>
          <dt className="text-muted">Margin at menu price</dt>
          <dd className="text-right text-muted">enter a menu price</dd>
        </div>
      )}
    </dl>
  );
}

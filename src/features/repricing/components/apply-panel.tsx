import { useState } from 'react';
import { Button, TextLink } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { useApplyPrices } from '../api/apply-prices';
import type { Impact } from '../api/types';

/** Apply every new price with an effective date, in one go; a 409 says someone else changed a price. */
export function ApplyPanel({ impact, scenarioId, keepLadder, today, onApplied }: { impact: Impact; scenarioId: string | null; keepLadder: boolean; today: string; onApplied: () => void }) {
  const [effectiveFrom, setEffectiveFrom] = useState(today);
  const [asking, setAsking] = useState(false);
  const [done, setDone] = useState<number | null>(null);
  const apply = useApplyPrices();
  const toast = useToast();
  const n = impact.prices.length;
  const error = apply.error ? (isApiError(apply.error) && apply.error.status === 409 ? apply.error.message : isApiError(apply.error) ? apply.error.message : 'The prices could not be applied. Try again.') : null;
  const go = () =>
    apply.mutate(
      {
        effectiveFrom,
        scenarioId: scenarioId ?? undefined,
        keepLadder,
        prices: impact.prices.map((p) => ({ drinkId: p.drinkId, size: p.size, price: p.price, priceVersion: p.priceVersion })),
      },
      {
        onSuccess: (r) => {
          setAsking(false);
          setDone(r.applied.length);
          toast.notify(r.planned ? `${r.applied.length} new prices scheduled for ${formatDate(r.effectiveFrom)}; the current prices stay until then.` : `${r.applied.length} new prices applied from ${formatDate(r.effectiveFrom)}.`);
          onApplied();
        },
      },
    );
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <Field label="New prices take effect on" className="w-56">
          <Input type="date" value={effectiveFrom} onChange={(e) => setEffectiveFrom(e.target.value)} />
        </Field>
        <Button onClick={() => setAsking(true)} disabled={n === 0 || !effectiveFrom}>
          Apply {n} new price{n === 1 ? '' : 's'}
        </Button>
      </div>
      {n === 0 && <p className="text-sm text-muted">Choose a new price for at least one size (take the suggested one or type one) to apply.</p>}
      {error && !asking && (
        <p role="alert" className="text-sm font-medium text-rose">
          {error}
        </p>
      )}
      {done !== null && (
        <p role="status" className="text-sm">
          {done} prices {effectiveFrom > today ? `scheduled for ${formatDate(effectiveFrom)}` : 'applied'}. <TextLink to={paths.priceList.href()}>Print the price list</TextLink>
        </p>
      )}
      <ConfirmDialog
        open={asking}
        title={`Apply ${n} new price${n === 1 ? '' : 's'}?`}
        consequence={
          <div className="flex flex-col gap-2">
            {effectiveFrom > today ? (
              <p>These are scheduled: the current prices stay until {formatDate(effectiveFrom)}, then these become the menu prices. Each change shows as planned in the drink&apos;s price history and can be cancelled before its date:</p>
            ) : (
              <p>These become the menu prices from {formatDate(effectiveFrom)}; each change is kept in the drink&apos;s price history. The current prices are replaced:</p>
            )}
            <ul className="max-h-48 overflow-auto text-sm">
              {impact.prices.map((p) => (
                <li key={p.drinkSizeId} className="tabular-nums">
                  {p.drinkName} · {p.size}: {p.oldPrice ? formatMoney(p.oldPrice, impact.currency) : 'no price'} → {formatMoney(p.price, impact.currency)}
                  {p.ladderOnly ? ' (to keep the ladder)' : ''}
                </li>
              ))}
            </ul>
          </div>
        }
        confirmLabel="Apply the new prices"
        busy={apply.isPending}
        error={asking ? error : null}
        onConfirm={go}
        onCancel={() => setAsking(false)}
      />
    </div>
  );
}

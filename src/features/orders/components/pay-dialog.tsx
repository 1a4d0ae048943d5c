import { useEffect, useId, useRef, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { focusRing } from '../../../components/ui/cx';
import { isApiError } from '../../../lib/api-client';
import { formatMoney } from '../../../lib/format';
import { usePayOrder } from '../api/order-actions';
import { usePaymentCard } from '../api/payment-card';
import type { Order } from '../api/types';

export function cardText(c: { brand: string | null; last4: string | null; expMonth: number | null; expYear: number | null }): string {
  const brand = c.brand ? c.brand[0].toUpperCase() + c.brand.slice(1) : 'Card';
  const exp = c.expMonth && c.expYear ? `, expires ${String(c.expMonth).padStart(2, '0')}/${String(c.expYear).slice(-2)}` : '';
  return `${brand} ending ${c.last4 ?? '····'}${exp}`;
}

/** Why a pay press did not charge, in plain words. */
function payFailure(err: unknown): string {
  if (!isApiError(err)) return 'Something went wrong. Nothing was charged. Try again.';
  if (err.code === 'payments_unreachable') return 'The card processor could not be reached, so nothing was charged and the order is as it was. Try again in a few minutes.';
  if (err.code === 'payment_in_progress') return 'A payment for this order is already going through. Wait a moment; this page will show the outcome.';
  return err.message;
}

/**
 * Pays a placed order with the business's saved card (owner only). In test mode the page
 * says so and offers the published test cards instead; a live build would collect the card in
 * the payment provider's own form here and pass its payment-method id the same way.
 */
export function PayDialog({ order, open, onClose }: { order: Order; open: boolean; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const card = usePaymentCard(open);
  const pay = usePayOrder();
  const [choice, setChoice] = useState<string>('');
  const saved = card.data?.card ?? null;
  const testMode = card.data?.testMode ?? false;
  const selected = choice || saved?.paymentMethodId || card.data?.testCards[0]?.id || '';

  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);

  const close = () => {
    if (pay.isPending) return;
    pay.reset();
    onClose();
  };

  return (
    <dialog ref={ref} aria-labelledby={titleId} onCancel={(e) => { e.preventDefault(); close(); }}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg border border-rule bg-card p-6 text-ink shadow-xl backdrop:bg-ink/40">
      <h2 id={titleId} className="text-lg font-bold">Pay {order.number}</h2>
      <p className="mt-1">
        <span className="text-2xl font-bold tabular-nums">{formatMoney(order.total, order.currency)}</span>{' '}
        <span className="text-muted">to {order.supplier.name}</span>
      </p>
      {testMode && (
        <p className="mt-3 rounded-md border border-butter bg-butter/20 px-3 py-2 text-sm font-medium text-ink">
          Test mode — no real card is charged. Choose one of the published test cards to see how each outcome looks.
        </p>
      )}
      {card.isPending ? (
        <p className="mt-4 text-muted">Loading the saved card…</p>
      ) : card.isError ? (
        <p role="alert" className="mt-4 text-rose">The saved card could not be loaded: {isApiError(card.error) ? card.error.message : 'try again.'}</p>
      ) : (
        <fieldset className="mt-4 flex flex-col gap-2">
          <legend className="mb-1 text-sm font-medium">Pay with</legend>
          {saved && (
            <label className="flex items-center gap-2">
              <input type="radio" name="pay-with" className={`h-4 w-4 accent-copper ${focusRing}`} checked={selected === saved.paymentMethodId} onChange={() => setChoice(saved.paymentMethodId)} />
              <span>The business's card: {cardText(saved)}</span>
            </label>
          )}
          {testMode && card.data.testCards.map((c) => (
            <label key={c.id} className="flex items-center gap-2">
              <input type="radio" name="pay-with" className={`h-4 w-4 accent-copper ${focusRing}`} checked={selected === c.id} onChange={() => setChoice(c.id)} />
              <span>{c.label} <code className="text-xs text-muted">{c.id}</code></span>
            </label>
          ))}
          {!saved && !testMode && <p className="text-ink">No card is saved for the business yet. Save one in Settings, then pay.</p>}
        </fieldset>
      )}
      {pay.isError && <p role="alert" className="mt-3 text-sm font-medium text-rose">{payFailure(pay.error)}</p>}
      <p className="mt-3 text-xs text-muted">The order is charged once, however many times this is pressed.</p>
      <div className="mt-5 flex justify-end gap-3">
        <Button variant="secondary" onClick={close} disabled={pay.isPending} autoFocus>Not now</Button>
        <Button busy={pay.isPending} disabled={!selected}
          onClick={() => pay.mutate({ id: order.id, paymentMethodId: selected }, { onSuccess: () => onClose() })}>
          Pay {formatMoney(order.total, order.currency)}
        </Button>
      </div>
    </dialog>
  );
}

import { useId, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { usePaymentCard, useRemovePaymentCard, useSavePaymentCard } from '../api/payment-card';
import { cardText } from './pay-dialog';

/**
 * The business's card for paying suppliers who take card orders. Card numbers never reach our
 * server: in live use the payment provider's own card form goes where the test-card choice is
 * (it hands back a payment-method id, saved the same way); in test mode the published test ids stand in.
 */
export function SavedCard() {
  const card = usePaymentCard();
  const save = useSavePaymentCard();
  const remove = useRemovePaymentCard();
  const { notify } = useToast();
  const [choice, setChoice] = useState('');
  const [confirming, setConfirming] = useState(false);
  const id = useId();
  if (card.isPending) return <SkeletonRows rows={2} label="Loading the saved card" />;
  if (card.isError) return <ErrorState error={card.error} onRetry={() => card.refetch()} />;
  const { card: saved, testMode, testCards } = card.data;
  const selected = choice || testCards[0]?.id || '';
  return (
    <div className="flex flex-col gap-4">
      {testMode && (
        <p className="rounded-md border border-butter bg-butter/20 px-3 py-2 text-sm font-medium text-ink">
          Test mode — no real card is charged. Save one of the published test cards to try paying orders.
        </p>
      )}
      <p className="text-ink" data-saved-card>
        {saved ? <>Orders are paid with <span className="font-medium">{cardText(saved)}</span>.</> : 'No card saved yet. Orders from suppliers paid by card cannot be paid until one is.'}
      </p>
      {testMode ? (
        <div className="flex flex-wrap items-end gap-3">
          <div className="flex min-w-64 flex-col gap-1">
            <label htmlFor={id} className="text-sm font-medium text-ink">Test card</label>
            <Select id={id} value={selected} onChange={(e) => setChoice(e.target.value)}>
              {testCards.map((c) => <option key={c.id} value={c.id}>{c.label}</option>)}
            </Select>
          </div>
          <Button busy={save.isPending} disabled={!selected} onClick={() => save.mutate(selected, { onSuccess: () => notify('Card saved.') })}>
            {saved ? 'Replace the card' : 'Save this card'}
          </Button>
        </div>
      ) : (
        <p className="text-sm text-muted">Adding a live card opens the payment provider's own secure form; it is not connected in this build.</p>
      )}
      {save.isError && <p role="alert" className="text-sm font-medium text-rose">{isApiError(save.error) ? (Object.values(save.error.fields)[0] ?? save.error.message) : 'The card was not saved. Try again.'}</p>}
      {saved && (
        <div>
          <Button variant="secondary" onClick={() => setConfirming(true)}>Remove the card</Button>
        </div>
      )}
      <ConfirmDialog
        open={confirming}
        title="Remove the saved card?"
        consequence="Orders already paid stay paid. Until a card is saved again, orders from suppliers paid by card cannot be paid."
        confirmLabel="Remove the card"
        busy={remove.isPending}
        error={remove.isError ? (isApiError(remove.error) ? remove.error.message : 'That did not work.') : null}
        onCancel={() => setConfirming(false)}
        onConfirm={() => remove.mutate(undefined, { onSuccess: () => { setConfirming(false); notify('Card removed.'); } })}
      />
    </div>
  );
}

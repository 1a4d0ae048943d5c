import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney, formatQuantity } from '../../../lib/format';
import { UNITS, isUnitCode } from '../../../shared/units';
import { useDeleteWaste } from '../api/waste';
import type { WasteEntry } from '../api/types';

const unitLabel = (e: WasteEntry) => (e.unit === null ? (e.quantity === '1' ? 'cup' : 'cups') : isUnitCode(e.unit) ? UNITS[e.unit].symbol : e.unit);

/** The month's waste at cost, newest first, with the month's total; entries can be taken back by those who record waste. */
export function WasteList({ entries, total, currency, canDelete }: { entries: WasteEntry[]; total: string; currency: string; canDelete: boolean }) {
  const [removing, setRemoving] = useState<WasteEntry | null>(null);
  const remove = useDeleteWaste();
  if (entries.length === 0) return <EmptyState title="No waste recorded this month" next="When milk is poured away, a drink is remade or stock goes out of date, record it above: it shows in the month's cost of goods." />;
  const sorted = [...entries].sort((a, b) => (a.occurredOn === b.occurredOn ? 0 : a.occurredOn < b.occurredOn ? 1 : -1));
  return (
    <>
      <Table caption="Waste this month">
        <THead>
          <tr>
            <Th>Day</Th>
            <Th>Item</Th>
            <Th figure>Quantity</Th>
            <Th>Why</Th>
            <Th figure>Value at cost</Th>
            {canDelete && <Th><span className="sr-only">Actions</span></Th>}
          </tr>
        </THead>
        <tbody>
          {sorted.map((e) => (
            <tr key={e.id} data-waste={e.id}>
              <Td className="whitespace-nowrap">{formatDate(e.occurredOn)}</Td>
              <Td>
                {e.item.name}
                {e.recordedBy && <span className="block text-sm text-muted">by {e.recordedBy}</span>}
              </Td>
              <Td figure className="whitespace-nowrap">{formatQuantity(e.quantity, unitLabel(e))}</Td>
              <Td>{e.reason}</Td>
              <Td figure>{e.value ? formatMoney(e.value, currency) : <span className="text-muted" title={e.problem ?? undefined}>not costed</span>}</Td>
              {canDelete && (
                <Td>
                  <Button variant="quiet" size="sm" onClick={() => setRemoving(e)} aria-label={`Remove the waste of ${e.item.name} on ${formatDate(e.occurredOn)}`}>
                    Remove
                  </Button>
                </Td>
              )}
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr>
            <Td className="font-bold" colSpan={4}>Total this month</Td>
            <Td figure className="font-bold" data-testid="waste-total">{formatMoney(total, currency)}</Td>
            {canDelete && <Td />}
          </tr>
        </tfoot>
      </Table>
      <ConfirmDialog
        open={removing !== null}
        title="Remove this waste entry?"
        consequence={removing && <p>{formatQuantity(removing.quantity, unitLabel(removing))} of {removing.item.name} on {formatDate(removing.occurredOn)} will no longer count in the month's waste.</p>}
        confirmLabel="Remove"
        busy={remove.isPending}
        error={remove.error ? (isApiError(remove.error) ? remove.error.message : 'Not removed: try again.') : undefined}
        onCancel={() => setRemoving(null)}
        onConfirm={() => removing && remove.mutate(removing.id, { onSuccess: () => setRemoving(null) })}
      />
    </>
  );
}

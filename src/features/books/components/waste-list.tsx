import { useCallback, useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { Field } from '../../../components/ui/field';
import { Select } from '../../../components/ui/input';
import { SortHeader, Table, TableFilters, TableSearch, Td, Th, THead, useSortedRows } from '../../../components/ui/table';
import { matchesSearch } from '../../../components/ui/table-rows';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney, formatQuantity } from '../../../lib/format';
import { D, dec } from '../../../shared/decimal';
import { UNITS, isUnitCode } from '../../../shared/units';
import { useDeleteWaste } from '../api/waste';
import type { WasteEntry } from '../../../shared/contract/books';

type SortKey = 'occurredOn' | 'item' | 'quantity' | 'reason' | 'value';

const unitLabel = (e: WasteEntry) => (e.unit === null ? (e.quantity === '1' ? 'cup' : 'cups') : isUnitCode(e.unit) ? UNITS[e.unit].symbol : e.unit);

/**
 * The month's waste, newest first; for roles that read costs (the answer then carries the
 * month's `total`) each entry's value at cost and the totals. Entries can be taken back by those
 * who record waste.
 */
export function WasteList({ entries, total, currency, canDelete }: { entries: WasteEntry[]; total: string | undefined; currency: string; canDelete: boolean }) {
  const valued = total !== undefined;
  const [removing, setRemoving] = useState<WasteEntry | null>(null);
  const [search, setSearch] = useState('');
  const [reason, setReason] = useState('');
  const remove = useDeleteWaste();
  const reasons = useMemo(() => [...new Set(entries.map((e) => e.reason))].sort(), [entries]);
  const shown = useMemo(() => entries.filter((e) => (!reason || e.reason === reason) && matchesSearch(search, e.item.name, e.reason, e.recordedBy)), [entries, search, reason]);
  const value = useCallback((e: WasteEntry, key: SortKey) => (key === 'item' ? e.item.name : e[key]), []);
  const { sorted, sort, onSort } = useSortedRows<WasteEntry, SortKey>(shown, { key: 'occurredOn', direction: 'desc' }, value);
  if (entries.length === 0) return <EmptyState title="No waste recorded this month" next="When milk is poured away, a drink is remade or stock goes out of date, record it above: it shows in the month's cost of goods." />;
  const filtered = shown.length < entries.length;
  const shownTotal = shown.reduce((t, e) => (e.value ? t.plus(dec(e.value)) : t), new D(0)).toFixed();
  return (
    <div className="flex flex-col gap-4">
      <TableFilters shown={shown.length} total={entries.length}>
        <TableSearch label="Search waste" value={search} onChange={setSearch} placeholder="Item, reason or who" />
        <Field label="Reason" className="w-48">
          <Select value={reason} onChange={(e) => setReason(e.target.value)}>
            <option value="">Every reason</option>
            {reasons.map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </Select>
        </Field>
      </TableFilters>
      <Table caption="Waste this month">
        <THead>
          <tr>
            <SortHeader label="Day" sortKey="occurredOn" sort={sort} onSort={onSort} />
            <SortHeader label="Item" sortKey="item" sort={sort} onSort={onSort} />
            <SortHeader label="Quantity" sortKey="quantity" sort={sort} onSort={onSort} figure />
            <SortHeader label="Why" sortKey="reason" sort={sort} onSort={onSort} />
            {valued && <SortHeader label="Value at cost" sortKey="value" sort={sort} onSort={onSort} figure />}
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
              {valued && <Td figure>{e.value ? formatMoney(e.value, currency) : <span className="text-muted" title={e.problem ?? undefined}>not costed</span>}</Td>}
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
        {valued && (
        <tfoot>
          {filtered && (
            <tr>
              <Td className="font-medium" colSpan={4}>Total of the {shown.length} shown</Td>
              <Td figure className="font-medium" data-testid="waste-shown-total">{formatMoney(shownTotal, currency)}</Td>
              {canDelete && <Td />}
            </tr>
          )}
          <tr>
            <Td className="font-bold" colSpan={4}>Total this month</Td>
            <Td figure className="font-bold" data-testid="waste-total">{formatMoney(total as string, currency)}</Td>
            {canDelete && <Td />}
          </tr>
        </tfoot>
        )}
      </Table>
      {sorted.length === 0 && <EmptyState title="No waste matches" next="Clear the search or choose every reason." />}
      <ConfirmDialog
        open={removing !== null}
        title="Remove this waste entry?"
        consequence={removing && <p>{formatQuantity(removing.quantity, unitLabel(removing))} of {removing.item.name} on {formatDate(removing.occurredOn)} will no longer count in the month's waste.</p>}
        confirmLabel="Remove"
        busy={remove.isPending}
        error={remove.error ? (isApiError(remove.error) ? remove.error.message : 'Not removed: try again.') : undefined}
        onCancel={() => setRemoving(null)}
        onConfirm={() => removing && remove.mutate({ params: { id: removing.id } }, { onSuccess: () => setRemoving(null) })}
      />
    </div>
  );
}

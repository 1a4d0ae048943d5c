import { useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { CardSection } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, TextArea } from '../../../components/ui/input';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { StatusMark } from '../../../components/ui/status-mark';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatMoney } from '../../../lib/format';
import { applyServerErrors } from '../../../lib/form-errors';
import { paths } from '../../../lib/paths';
import { minimumShortfall, orderLineSchema, orderTotals } from '../../../shared/ordering';
import { useCatalogue } from '../api/get-catalogue';
import { useCreateOrder, useUpdateOrder } from '../api/save-order';
import type { CataloguePack } from '../api/types';
import { PackPicker } from './pack-picker';

const editorSchema = z.object({
  lines: z.array(orderLineSchema).min(1, 'Add at least one pack to the order.'),
  notes: z.string().trim().max(2000, 'Use at most 2000 characters.'),
});
type EditorIn = z.input<typeof editorSchema>;
type EditorOut = z.output<typeof editorSchema>;

const WHOLE = /^\d+$/;

export interface EditorTarget {
  site: { id: string; name: string };
  supplier: { id: string; name: string; minimumOrder: string; deliveryCharge: string };
  currency: string;
  /** Present when editing a saved draft. */
  order?: { id: string; number: string; version: number };
  lines: { packId: string; quantity: string }[];
  notes: string;
}

/** Lines of a draft purchase order with a pack picker; totals follow every keystroke with the same arithmetic as the server. */
export function OrderEditor({ target }: { target: EditorTarget }) {
  const catalogue = useCatalogue(target.supplier.id);
  if (catalogue.isPending) return <SkeletonRows rows={5} label={`Loading ${target.supplier.name}'s packs`} />;
  if (catalogue.isError) return <ErrorState error={catalogue.error} onRetry={() => catalogue.refetch()} />;
  if (catalogue.data.packs.length === 0)
    return <EmptyState title={`No packs from ${target.supplier.name} yet`} next="Add the packs you buy from them on the ingredients' pages, with their prices; then order them here." />;
  return <Form target={target} packs={catalogue.data.packs} />;
}

function Form({ target, packs }: { target: EditorTarget; packs: CataloguePack[] }) {
  const navigate = useNavigate();
  const { notify } = useToast();
  const create = useCreateOrder();
  const update = useUpdateOrder();
  const [formError, setFormError] = useState<string | null>(null);
  const byId = useMemo(() => new Map(packs.map((p) => [p.id, p])), [packs]);
  const { register, control, handleSubmit, setError, formState: { errors } } = useForm<EditorIn, unknown, EditorOut>({
    resolver: zodResolver(editorSchema),
    defaultValues: { lines: target.lines.filter((l) => byId.has(l.packId)), notes: target.notes },
    shouldFocusError: true,
  });
  const { fields, append, remove } = useFieldArray({ control, name: 'lines' });
  const lines = useWatch({ control, name: 'lines' });
  const { currency } = target;

  const totals = useMemo(() => {
    const priced = lines.map((l) => {
      const p = byId.get(l.packId);
      return { quantity: WHOLE.test(l.quantity.trim()) ? l.quantity.trim() : '0', unitPrice: p?.price ?? '0', taxPct: p?.taxPct ?? '0' };
    });
    const t = orderTotals(priced, target.supplier.deliveryCharge, currency);
    return { ...t, shortfall: minimumShortfall(t.subtotal, target.supplier.minimumOrder, currency) };
  }, [lines, byId, target.supplier, currency]);

  const taken = useMemo(() => new Set(lines.map((l) => l.packId)), [lines]);

  const onSubmit = handleSubmit((v) => {
    setFormError(null);
    const body = { lines: v.lines.map((l) => ({ packId: l.packId, quantity: l.quantity })), notes: v.notes || null };
    const done = (order: { id: string; number: string }) => {
      notify(`${order.number} saved as a draft.`);
      navigate(paths.order.href(order.id));
    };
    const fail = (err: unknown) => {
      if (isApiError(err) && err.code === 'stale') setFormError('Someone else changed this draft since you opened it. Reload the page to see their changes, then edit again.');
      else setFormError(applyServerErrors(err, setError, ['notes', ...v.lines.flatMap((_, i) => [`lines.${i}.quantity`, `lines.${i}.packId`])]));
    };
    if (target.order) update.mutate({ id: target.order.id, version: target.order.version, ...body }, { onSuccess: done, onError: fail });
    else create.mutate({ siteId: target.site.id, supplierId: target.supplier.id, ...body }, { onSuccess: done, onError: fail });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      <FormMessage>{formError}</FormMessage>
      <CardSection title="Packs on this order">
        <div className="flex flex-col gap-5">
          {fields.length === 0 ? (
            <EmptyState title="No packs on the order yet" next="Find a pack below and add it." />
          ) : (
            <Table caption="Order lines">
              <THead>
                <tr>
                  <Th>Pack</Th>
                  <Th figure>Pack price</Th>
                  <Th figure>Packs</Th>
                  <Th figure>Line total</Th>
                  <Th><span className="sr-only">Remove</span></Th>
                </tr>
              </THead>
              <tbody>
                {fields.map((f, i) => {
                  const p = byId.get(f.packId);
                  const err = errors.lines?.[i]?.quantity?.message;
                  return (
                    <tr key={f.id} data-line={f.packId}>
                      <Td>{p?.description ?? 'A pack no longer sold'}</Td>
                      <Td figure>{p?.price ? formatMoney(p.price, currency) : '—'}</Td>
                      <Td figure>
                        <Input inputMode="numeric" className="ml-auto w-20! py-1" aria-label={`Packs of ${p?.description ?? 'this pack'}`}
                          aria-invalid={err ? true : undefined} {...register(`lines.${i}.quantity`)} />
                        {err && <p className="mt-1 text-xs font-medium text-rose">{err}</p>}
                      </Td>
                      <Td figure>{formatMoney(totals.lines[i]?.lineTotal ?? '0', currency)}</Td>
                      <Td className="text-right">
                        <Button size="sm" variant="quiet" onClick={() => remove(i)} aria-label={`Remove ${p?.description ?? 'this line'}`}>Remove</Button>
                      </Td>
                    </tr>
                  );
                })}
              </tbody>
            </Table>
          )}
          {errors.lines?.root?.message || errors.lines?.message ? (
            <p role="alert" className="text-sm font-medium text-rose">{errors.lines?.root?.message ?? errors.lines?.message}</p>
          ) : null}
          <PackPicker packs={packs} taken={taken} currency={currency} onPick={(p) => append({ packId: p.id, quantity: '1' })} />
        </div>
      </CardSection>

      <div className="grid gap-6 md:grid-cols-[1fr_auto]">
        <Field label="Notes for the supplier" hint="Printed on the order." error={errors.notes?.message}>
          <TextArea rows={3} {...register('notes')} />
        </Field>
        <div className="min-w-64 rounded-lg border border-rule bg-card p-4" aria-live="polite">
          <dl className="grid grid-cols-[1fr_auto] gap-x-6 gap-y-1 text-sm" data-totals>
            <dt className="text-muted">Goods ({fields.length} {fields.length === 1 ? 'line' : 'lines'})</dt><dd className="text-right tabular-nums" data-total="subtotal">{formatMoney(totals.subtotal, currency)}</dd>
            <dt className="text-muted">Purchase tax</dt><dd className="text-right tabular-nums" data-total="tax">{formatMoney(totals.tax, currency)}</dd>
            <dt className="text-muted">Delivery</dt><dd className="text-right tabular-nums" data-total="delivery">{formatMoney(totals.deliveryCharge, currency)}</dd>
            <dt className="border-t border-rule pt-1 font-medium">Total</dt><dd className="border-t border-rule pt-1 text-right font-bold tabular-nums" data-total="total">{formatMoney(totals.total, currency)}</dd>
          </dl>
          {totals.shortfall && (
            <p className="mt-3"><StatusMark tone="attention">{formatMoney(totals.shortfall, currency)} below the {formatMoney(target.supplier.minimumOrder, currency)} minimum</StatusMark></p>
          )}
          <p className="mt-2 text-xs text-muted">Prices are today's pack prices; the server prices the order again when it is saved.</p>
        </div>
      </div>

      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={create.isPending || update.isPending}>{target.order ? 'Save draft' : 'Save as draft'}</Button>
        <Button variant="secondary" onClick={() => navigate(-1)}>Back without saving</Button>
      </div>
    </form>
  );
}

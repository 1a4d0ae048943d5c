import { useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button, ButtonLink, TextLink } from '../../../components/ui/button';
import { CardSection } from '../../../components/ui/card';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, TextArea } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { formatDate, formatMoney, formatQuantity } from '../../../lib/format';
import { applyServerErrors } from '../../../lib/form-errors';
import { paths } from '../../../lib/paths';
import { dec } from '../../../shared/decimal';
import { receiveLineSchema } from '../../../shared/ordering';
import { useAcceptInvoicePrice, useReceiveOrder, type PackPriceResult } from '../api/receive-order';
import type { Order, ReceiptResult } from '../api/types';

const formSchema = z.object({
  lines: z.array(receiveLineSchema.extend({ note: z.string().trim().max(500, 'Use at most 500 characters.') })).min(1),
  receivedOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter the day it arrived.'),
  invoiceNumber: z.string().trim().max(80, 'Use at most 80 characters.'),
  notes: z.string().trim().max(2000, 'Use at most 2000 characters.'),
});
type FormIn = z.input<typeof formSchema>;
type FormOut = z.output<typeof formSchema>;

const today = () => new Date().toLocaleDateString('en-CA'); // YYYY-MM-DD in the reader's zone

function differs(a: string, b: string | null): boolean {
  if (b === null) return false;
  try {
    return !dec(a.trim()).eq(dec(b));
  } catch {
    return false;
  }
}

/** What arrived, per line: quantity and the price on the supplier's invoice; shortages and notes. Stock rises as it is saved. */
export function ReceiveForm({ order, onReceived }: { order: Order; onReceived: (result: ReceiptResult) => void }) {
  const receive = useReceiveOrder();
  const { notify } = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const { currency } = order;
  const { register, control, handleSubmit, setError, formState: { errors } } = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(formSchema),
    defaultValues: {
      lines: order.lines.map((l) => {
        const left = dec(l.quantity).minus(dec(l.quantityReceived));
        return { lineId: l.id, quantityReceived: left.gt(0) ? left.toFixed() : '0', unitPrice: l.unitPrice, note: l.note ?? '' };
      }),
      receivedOn: today(),
      invoiceNumber: order.supplierInvoiceNumber ?? '',
      notes: '',
    },
    shouldFocusError: true,
  });
  const { fields } = useFieldArray({ control, name: 'lines', keyName: 'key' });
  const values = useWatch({ control, name: 'lines' });

  const onSubmit = handleSubmit((v) => {
    setFormError(null);
    receive.mutate(
      {
        id: order.id,
        receivedOn: v.receivedOn,
        invoiceNumber: v.invoiceNumber || null,
        notes: v.notes || null,
        lines: v.lines.map((l) => ({ lineId: l.lineId, quantityReceived: l.quantityReceived, unitPrice: l.unitPrice, note: l.note || null })),
      },
      {
        onSuccess: (res) => {
          notify('Delivery received; stock updated.');
          onReceived(res.receipt);
        },
        onError: (err) => setFormError(applyServerErrors(err, setError, ['receivedOn', 'invoiceNumber', 'notes', ...v.lines.flatMap((_, i) => [`lines.${i}.quantityReceived`, `lines.${i}.unitPrice`, `lines.${i}.note`])])),
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      <FormMessage>{formError}</FormMessage>
      <CardSection title="What arrived">
        <p className="mb-4 max-w-prose text-sm text-muted">
          Enter the packs that came on each line (less than ordered records a shortage) and the price per pack on the supplier's invoice. Note substitutions on the line.
        </p>
        <Table caption="Lines received">
          <THead>
            <tr>
              <Th>Pack</Th>
              <Th figure>Ordered</Th>
              <Th figure>Packs received</Th>
              <Th figure>Invoice price per pack</Th>
              <Th>Note (shortage, substitution)</Th>
            </tr>
          </THead>
          <tbody>
            {fields.map((f, i) => {
              const line = order.lines[i];
              const e = errors.lines?.[i];
              const v = values[i];
              const short = v && /^\d+(\.\d+)?$/.test(v.quantityReceived.trim()) && dec(v.quantityReceived.trim()).plus(dec(line.quantityReceived)).lt(dec(line.quantity));
              const priceChanged = v && differs(v.unitPrice, line.unitPrice);
              return (
                <tr key={f.key} data-line={line.packId}>
                  <Td className="min-w-40">
                    {line.description}
                    {line.quantityReceived !== '0' && <span className="block text-xs text-muted">{formatQuantity(line.quantityReceived)} received before</span>}
                  </Td>
                  <Td figure>{formatQuantity(line.quantity)}</Td>
                  <Td figure>
                    <Input inputMode="decimal" className="ml-auto w-20! py-1" aria-label={`Packs received, ${line.description}`} aria-invalid={e?.quantityReceived ? true : undefined} {...register(`lines.${i}.quantityReceived`)} />
                    {e?.quantityReceived && <p className="mt-1 text-xs font-medium text-rose">{e.quantityReceived.message}</p>}
                    {short && <span className="mt-1 inline-block whitespace-nowrap"><StatusMark tone="attention">short</StatusMark></span>}
                  </Td>
                  <Td figure>
                    <div className="flex items-center justify-end gap-1">
                      <Input inputMode="decimal" className="w-24! py-1" aria-label={`Invoice price, ${line.description}`} aria-invalid={e?.unitPrice ? true : undefined} {...register(`lines.${i}.unitPrice`)} />
                      <span className="text-xs text-muted">{currency}</span>
                    </div>
                    {e?.unitPrice && <p className="mt-1 text-xs font-medium text-rose">{e.unitPrice.message}</p>}
                    {priceChanged && <span className="mt-1 inline-block whitespace-nowrap"><StatusMark tone="info">ordered at {formatMoney(line.unitPrice, currency)}</StatusMark></span>}
                  </Td>
                  <Td>
                    <Input className="min-w-40 py-1" aria-label={`Note, ${line.description}`} {...register(`lines.${i}.note`)} />
                  </Td>
                </tr>
              );
            })}
          </tbody>
        </Table>
      </CardSection>
      <div className="grid gap-4 sm:grid-cols-3">
        <Field label="Arrived on" error={errors.receivedOn?.message}>
          <Input type="date" {...register('receivedOn')} />
        </Field>
        <Field label="Supplier's invoice number" error={errors.invoiceNumber?.message}>
          <Input {...register('invoiceNumber')} />
        </Field>
        <Field label="Notes on the delivery" error={errors.notes?.message} className="sm:col-span-3">
          <TextArea rows={2} {...register('notes')} />
        </Field>
      </div>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={receive.isPending}>Receive the delivery</Button>
        <ButtonLink variant="secondary" to={paths.order.href(order.id)}>Back to the order</ButtonLink>
      </div>
    </form>
  );
}

/** After receiving: the shortages, and each invoice price that differs from the pack price with an offer to update it. */
export function ReceiptSummary({ order, result, onPriceSaved }: { order: Order; result: ReceiptResult; onPriceSaved?: () => void }) {
  const { currency } = order;
  return (
    <div className="flex flex-col gap-6" data-receipt>
      <FormMessage tone="info">Delivery received and stock updated at {order.site.name}.</FormMessage>
      <CardSection title="Shortages">
        {result.shortages.length === 0 ? (
          <p className="text-ink">Everything ordered arrived.</p>
        ) : (
          <ul className="flex flex-col gap-1" data-shortages>
            {result.shortages.map((s) => (
              <li key={s.lineId} className="text-ink">
                <span className="font-medium">{s.description}</span>: {formatQuantity(s.received)} of {formatQuantity(s.ordered)} packs arrived, <strong>{formatQuantity(s.short)} short</strong>.
              </li>
            ))}
          </ul>
        )}
      </CardSection>
      <CardSection title="Invoice prices that differ">
        {result.priceChanges.length === 0 ? (
          <p className="text-ink">Every invoice price matches the pack price.</p>
        ) : (
          <ul className="flex flex-col gap-4" data-price-changes>
            {result.priceChanges.map((c) => <PriceChange key={c.lineId} orderId={order.id} change={c} currency={currency} onPriceSaved={onPriceSaved} />)}
          </ul>
        )}
      </CardSection>
      <div>
        <ButtonLink to={paths.order.href(order.id)}>Back to the order</ButtonLink>
      </div>
    </div>
  );
}

function PriceChange({ orderId, change, currency, onPriceSaved }: { orderId: string; change: ReceiptResult['priceChanges'][number]; currency: string; onPriceSaved?: () => void }) {
  const accept = useAcceptInvoicePrice(onPriceSaved);
  const [saved, setSaved] = useState<PackPriceResult['packPrice'] | null>(null);
  return (
    <li className="flex flex-col gap-2">
      <p className="text-ink">
        <span className="font-medium">{change.description}</span>: invoiced at <strong className="tabular-nums">{formatMoney(change.invoicePrice, currency)}</strong>, ordered at{' '}
        <span className="tabular-nums">{formatMoney(change.orderedPrice, currency)}</span>
        {change.packPrice && <> (pack price now <span className="tabular-nums">{formatMoney(change.packPrice, currency)}</span>)</>}.
      </p>
      {saved ? (
        <p className="text-ink">
          <StatusMark tone="good">pack price updated</StatusMark> {formatMoney(saved.price, currency)} from {formatDate(saved.effectiveFrom)}.{' '}
          <TextLink to={saved.repricingPath}>See what it does to your drinks' margins</TextLink>
        </p>
      ) : (
        <div className="flex flex-wrap items-center gap-3">
          <Button size="sm" variant="secondary" busy={accept.isPending} onClick={() => accept.mutate({ id: orderId, packId: change.packId }, { onSuccess: (r) => setSaved(r.packPrice) })}>
            Update the pack price to {formatMoney(change.invoicePrice, currency)}
          </Button>
          <span className="text-sm text-muted">or keep the current pack price.</span>
        </div>
      )}
      {accept.isError && <p role="alert" className="text-sm font-medium text-rose">{isApiError(accept.error) ? accept.error.message : 'That did not save. Try again.'}</p>}
    </li>
  );
}

import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { CardSection } from '../../../components/ui/card';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { focusRing } from '../../../components/ui/cx';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, TextArea } from '../../../components/ui/input';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { currencyDecimals } from '../../../lib/format';
import { applyServerErrors } from '../../../lib/form-errors';
import { paths } from '../../../lib/paths';
import { ISO_WEEKDAYS } from '../../../shared/ordering';
import type { Supplier } from '../../../shared/contract/suppliers';
import { useDeleteSupplier, useSaveSupplier } from '../api/save-supplier';
import { supplierFormSchema, weekdayName, type SupplierFormIn, type SupplierFormOut } from '../schemas';

const FIELDS = ['name', 'contactName', 'orderEmail', 'phone', 'accountNumber', 'notes', 'minimumOrder', 'deliveryDays', 'orderCutoff', 'leadDays', 'deliveryCharge', 'paymentTerms'] as const;

function defaults(s: Supplier | undefined, currency: string): SupplierFormIn {
  const zero = (0).toFixed(currencyDecimals(currency));
  return {
    name: s?.name ?? '',
    contactName: s?.contactName ?? '',
    orderEmail: s?.orderEmail ?? '',
    phone: s?.phone ?? '',
    accountNumber: s?.accountNumber ?? '',
    notes: s?.notes ?? '',
    minimumOrder: s?.minimumOrder ?? zero,
    deliveryDays: s?.deliveryDays ?? [],
    orderCutoff: s?.orderCutoff ?? '12:00',
    leadDays: s?.leadDays ?? 1,
    deliveryCharge: s?.deliveryCharge ?? zero,
    paymentTerms: s?.paymentTerms ?? 'account',
  };
}

/** A supplier's details and how they take orders: e-mail, minimum, delivery days, cut-off, lead time, charge, how paid. */
export function SupplierForm({ supplier, currency, canEdit }: { supplier?: Supplier; currency: string; canEdit: boolean }) {
  const save = useSaveSupplier();
  const remove = useDeleteSupplier();
  const navigate = useNavigate();
  const { notify } = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const { register, control, handleSubmit, setError, formState: { errors, isDirty } } = useForm<SupplierFormIn, unknown, SupplierFormOut>({
    resolver: zodResolver(supplierFormSchema),
    defaultValues: defaults(supplier, currency),
    shouldFocusError: true,
  });

  const onSubmit = handleSubmit((v) => {
    // Enter in a field while a save is under way would send it again (a page's other Save is not the busy one).
    if (save.isPending) return;
    setFormError(null);
    save.mutate(
      {
        id: supplier?.id,
        details: { name: v.name, contactName: v.contactName, orderEmail: v.orderEmail, phone: v.phone, accountNumber: v.accountNumber, notes: v.notes },
        ordering: { minimumOrder: v.minimumOrder, deliveryDays: v.deliveryDays, orderCutoff: v.orderCutoff, leadDays: v.leadDays, deliveryCharge: v.deliveryCharge, paymentTerms: v.paymentTerms },
      },
      {
        onSuccess: ({ supplier: saved }) => {
          notify(`${saved.name} saved.`);
          if (!supplier) navigate(paths.supplier.href(saved.id), { replace: true });
        },
        onError: (err) => setFormError(applyServerErrors(err, setError, FIELDS)),
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      <FormMessage>{formError}</FormMessage>
      <fieldset disabled={!canEdit} className="flex flex-col gap-6">
        <CardSection title="Supplier">
          <div className="grid gap-4 sm:grid-cols-2">
            <Field label="Name" error={errors.name?.message}>
              <Input autoComplete="organization" {...register('name')} />
            </Field>
            <Field label="Contact" error={errors.contactName?.message}>
              <Input autoComplete="name" {...register('contactName')} />
            </Field>
            <Field label="Order e-mail" hint="Placed orders are e-mailed here with the PDF attached." error={errors.orderEmail?.message}>
              <Input type="email" autoComplete="email" {...register('orderEmail')} />
            </Field>
            <Field label="Phone" error={errors.phone?.message}>
              <Input type="tel" autoComplete="tel" {...register('phone')} />
            </Field>
            <Field label="Our account number with them" error={errors.accountNumber?.message}>
              <Input {...register('accountNumber')} />
            </Field>
            <Field label="Notes" error={errors.notes?.message} className="sm:col-span-2">
              <TextArea rows={2} {...register('notes')} />
            </Field>
          </div>
        </CardSection>

        <CardSection title="Ordering">
          <div className="grid gap-4 sm:grid-cols-2">
            <fieldset className="flex flex-col gap-2 sm:col-span-2" aria-describedby={errors.paymentTerms ? 'terms-error' : undefined}>
              <legend className="mb-1 text-sm font-medium text-ink">How they are paid</legend>
              <label className="flex items-start gap-2 text-ink">
                <input type="radio" value="card" className={`mt-1 h-4 w-4 accent-copper ${focusRing}`} {...register('paymentTerms')} />
                <span>
                  <span className="font-medium">By card when ordering</span>: the owner pays each placed order with the business's saved card before it is delivered.
                </span>
              </label>
              <label className="flex items-start gap-2 text-ink">
                <input type="radio" value="account" className={`mt-1 h-4 w-4 accent-copper ${focusRing}`} {...register('paymentTerms')} />
                <span>
                  <span className="font-medium">On account</span>: they invoice later; a placed order can be received straight away.
                </span>
              </label>
              {errors.paymentTerms && <p id="terms-error" className="text-sm font-medium text-rose">{errors.paymentTerms.message}</p>}
            </fieldset>
            <Field label="Minimum order" hint="Goods before tax and delivery." unit={currency} error={errors.minimumOrder?.message}>
              <Input inputMode="decimal" {...register('minimumOrder')} />
            </Field>
            <Field label="Delivery charge" hint="Added to each order, without tax." unit={currency} error={errors.deliveryCharge?.message}>
              <Input inputMode="decimal" {...register('deliveryCharge')} />
            </Field>
            <Controller
              control={control}
              name="deliveryDays"
              render={({ field }) => (
                <fieldset className="flex flex-col gap-2 sm:col-span-2">
                  <legend className="mb-1 text-sm font-medium text-ink">Delivery days</legend>
                  <div className="flex flex-wrap gap-x-4 gap-y-2">
                    {ISO_WEEKDAYS.map((d) => (
                      <label key={d} className="flex items-center gap-2 text-ink">
                        <input
                          type="checkbox"
                          className={`h-4 w-4 accent-copper ${focusRing}`}
                          checked={field.value.includes(d)}
                          onChange={(e) => field.onChange(e.target.checked ? [...field.value, d].sort((a, b) => a - b) : field.value.filter((x) => x !== d))}
                          onBlur={field.onBlur}
                        />
                        <span>{weekdayName(d, 'long')}</span>
                      </label>
                    ))}
                  </div>
                  {errors.deliveryDays && <p className="text-sm font-medium text-rose">{errors.deliveryDays.message}</p>}
                </fieldset>
              )}
            />
            <Field label="Order cut-off" hint="Orders placed after this time count as placed the next day." error={errors.orderCutoff?.message}>
              <Input type="time" {...register('orderCutoff')} />
            </Field>
            <Field label="Lead time" hint="Days from the order day to the earliest delivery." unit="days" error={errors.leadDays?.message}>
              <Input inputMode="numeric" {...register('leadDays', { valueAsNumber: true })} />
            </Field>
          </div>
        </CardSection>
      </fieldset>

      {canEdit && (
        <div className="flex flex-wrap items-center justify-between gap-3">
          <Button type="submit" busy={save.isPending} disabled={Boolean(supplier) && !isDirty}>
            {supplier ? 'Save supplier' : 'Add supplier'}
          </Button>
          {supplier && (
            <Button variant="secondary" onClick={() => setConfirming(true)}>
              Remove supplier
            </Button>
          )}
        </div>
      )}
      {supplier && (
        <ConfirmDialog
          open={confirming}
          title={`Remove ${supplier.name}?`}
          consequence="Their details and ordering terms go. A supplier whose packs are still in use cannot be removed: move or remove those packs first."
          confirmLabel="Remove supplier"
          busy={remove.isPending}
          error={remove.error ? (isApiError(remove.error) ? remove.error.message : 'That did not work. Try again.') : null}
          onCancel={() => {
            setConfirming(false);
            remove.reset();
          }}
          onConfirm={() =>
            remove.mutate({ params: { id: supplier.id } }, {
              onSuccess: () => {
                notify(`${supplier.name} removed.`);
                navigate(paths.suppliers.href());
              },
            })
          }
        />
      )}
    </form>
  );
}

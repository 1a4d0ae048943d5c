import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { CountryOptions, CurrencyOptions } from '../../../components/ui/region-options';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { TaxModeField } from '../../../components/ui/tax-mode-field';
import { useToast } from '../../../components/ui/toast';
import { type Business } from '../../../shared/contract/auth';
import { applyServerErrors } from '../../../lib/form-errors';
import { useBusiness } from '../api/get-business';
import { useUpdateBusiness } from '../api/update-business';
import { businessSchema } from '../schemas';

type Schema = typeof businessSchema;

/** The runtime's IANA time zones, with the business's own first if the runtime does not list it. */
function timeZones(current: string): string[] {
  const all = Intl.supportedValuesOf('timeZone');
  return all.includes(current) ? all : [current, ...all];
}

function Form({ business }: { business: Business }) {
  const update = useUpdateBusiness();
  const { notify } = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors, isDirty } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(businessSchema),
    values: { name: business.name, country: business.country, currency: business.currency, taxMode: business.taxMode, taxName: business.taxName, timeZone: business.timeZone },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    update.mutate({ body: values }, {
      onSuccess: () => notify('Business details saved.'),
      onError: (err) => setFormError(applyServerErrors(err, setError, ['name', 'country', 'currency', 'taxMode', 'taxName', 'timeZone'])),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <FormMessage>{formError}</FormMessage>
      <Field label="Business name" error={errors.name?.message}>
        <Input autoComplete="organization" {...register('name')} />
      </Field>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Country" error={errors.country?.message}>
          <Select {...register('country')}>
            <CountryOptions />
          </Select>
        </Field>
        <Field label="Currency" error={errors.currency?.message}>
          <Select {...register('currency')}>
            <CurrencyOptions />
          </Select>
        </Field>
      </div>
      <p className="-mt-2 text-sm text-muted">Changing the currency does not convert amounts already entered.</p>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Name of the tax" hint="As on your receipts: VAT, GST, sales tax. Its rate is in Cup sizes and pricing." error={errors.taxName?.message}>
          <Input {...register('taxName')} />
        </Field>
        <Field label="Time zone" hint="The café's days and months (today, a sale's day, a month's end) are kept in it." error={errors.timeZone?.message}>
          <Select {...register('timeZone')}>
            {timeZones(business.timeZone).map((tz) => (
              <option key={tz} value={tz}>
                {tz.replaceAll('_', ' ')}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      <TaxModeField field={register('taxMode')} error={errors.taxMode?.message} />
      <div>
        <Button type="submit" busy={update.isPending} disabled={!isDirty}>
          Save business details
        </Button>
      </div>
    </form>
  );
}

export function BusinessForm() {
  const business = useBusiness();
  if (business.isPending) return <SkeletonRows rows={3} label="Loading the business details" />;
  if (business.isError) return <ErrorState error={business.error} onRetry={() => business.refetch()} />;
  return <Form business={business.data} />;
}

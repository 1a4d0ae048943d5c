import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input, Select } from '../../../components/ui/input';
import { CountryOptions, CurrencyOptions } from '../../../components/ui/region-options';
import { TaxModeField } from '../../../components/ui/tax-mode-field';
import { isApiError } from '../../../lib/api-client';
import { applyServerErrors } from '../../../lib/form-errors';
import { countryDefaults } from '../../../shared/countries';
import { useSignup } from '../api/signup';
import { signUpSchema } from '../schemas';

type Schema = typeof signUpSchema;
type Values = z.input<Schema>;
const fieldNames = ['name', 'email', 'password', 'businessName', 'siteName', 'country', 'currency', 'taxMode', 'taxName', 'taxRatePct'] as const;

/** The device's own settings: its region for the country, its time zone for the business's days. */
function fromDevice(): { country: string; timeZone: string | undefined } {
  let country = '';
  try {
    country = new Intl.Locale(navigator.language).maximize().region ?? '';
  } catch {
    country = '';
  }
  return { country, timeZone: Intl.DateTimeFormat().resolvedOptions().timeZone };
}

/** What a country sets, as form values (a rate the owner must enter stays empty). */
function countryValues(code: string): Partial<Values> {
  const d = countryDefaults(code);
  if (!d) return {};
  return { currency: d.currency, taxMode: d.taxMode, taxName: d.taxName, taxRatePct: d.standardRatePct ?? '' };
}

export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const signup = useSignup();
  const [formError, setFormError] = useState<string | null>(null);
  const [device] = useState(fromDevice);
  const { register, handleSubmit, setError, setValue, control, formState: { errors } } = useForm<Values, unknown, z.output<Schema>>({
    resolver: zodResolver(signUpSchema),
    defaultValues: {
      name: '', email: '', password: '', businessName: '', siteName: '', country: device.country, currency: '', taxMode: undefined, taxName: '', taxRatePct: '',
      timeZone: device.timeZone,
      ...countryValues(device.country),
    },
  });
  const [countryCode, taxNameValue, taxMode, rate] = useWatch({ control, name: ['country', 'taxName', 'taxMode', 'taxRatePct'] });
  const country = countryDefaults(countryCode ?? '');
  const taxName = taxNameValue || 'Tax';
  const inclusive = taxMode === 'inclusive';

  const chooseCountry = (code: string) => {
    for (const [k, v] of Object.entries(countryValues(code))) setValue(k as keyof Values, v as never, { shouldValidate: false });
  };

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    // A rate left empty where none is standard (sales tax added at the till) starts at 0 %.
    signup.mutate({ body: { ...values, taxRatePct: values.taxRatePct || '0' } }, {
      onSuccess: onSignedUp,
      onError: (err) => {
        if (isApiError(err) && err.status === 409) {
          setError('email', { type: 'server', message: 'An account already uses this e-mail. Sign in instead, or use another address.' }, { shouldFocus: true });
        } else setFormError(applyServerErrors(err, setError, fieldNames));
      },
    });
  });

  const countryField = register('country');
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      <FormMessage>{formError}</FormMessage>
      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 font-bold text-ink">You</legend>
        <Field label="Your name" error={errors.name?.message}>
          <Input autoComplete="name" autoFocus {...register('name')} />
        </Field>
        <Field label="E-mail" error={errors.email?.message}>
          <Input type="email" autoComplete="email" {...register('email')} />
        </Field>
        <Field label="Password" hint="At least 10 characters." error={errors.password?.message}>
          <Input type="password" autoComplete="new-password" {...register('password')} />
        </Field>
      </fieldset>

      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 font-bold text-ink">The business</legend>
        <Field label="Business name" error={errors.businessName?.message}>
          <Input autoComplete="organization" {...register('businessName')} />
        </Field>
        <Field label="First café or site" hint="You can add more sites later in Settings." error={errors.siteName?.message}>
          <Input placeholder="e.g. High Street" {...register('siteName')} />
        </Field>
        <Field label="Country" hint="Sets the currency and the tax below; change any of them if they are not yours." error={errors.country?.message}>
          <Select autoComplete="country" {...countryField} onChange={(e) => { void countryField.onChange(e); chooseCountry(e.target.value); }}>
            <CountryOptions />
          </Select>
        </Field>
      </fieldset>

      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 font-bold text-ink">Prices and tax</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field label="Currency" error={errors.currency?.message}>
            <Select {...register('currency')}>
              <CurrencyOptions />
            </Select>
          </Field>
          <Field label="Name of the tax" error={errors.taxName?.message}>
            <Input {...register('taxName')} />
          </Field>
        </div>
        <Field
          label={`${taxName} rate`}
          unit="%"
          hint={country ? (country.standardRatePct ? `Standard rate in ${country.code}: ${country.standardRatePct} % (${country.source}).` : `No single rate: it is ${country.source}. Enter yours.`) : 'Enter the standard rate where you trade.'}
          error={errors.taxRatePct?.message}
        >
          <Input inputMode="decimal" className="w-28" {...register('taxRatePct')} />
        </Field>
        {inclusive && (rate === '' || Number(rate) === 0) && (
          <p role="status" className="rounded-md border border-rose bg-rose/10 px-3 py-2 text-sm text-ink">
            <span className="font-medium">Menu prices include {taxName} at 0 %.</span> Suggested prices will leave no room for the tax. Enter your rate if you charge one.
          </p>
        )}
        <TaxModeField field={register('taxMode')} error={errors.taxMode?.message} />
      </fieldset>

      <p className="text-sm text-muted">
        Days and months are kept in this device&apos;s time zone, {device.timeZone ?? 'UTC'}; change it in Settings if the café is elsewhere.
      </p>

      <Button type="submit" busy={signup.isPending} size="lg">
        Create the business account
      </Button>
    </form>
  );
}

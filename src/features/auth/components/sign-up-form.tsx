import { useState } from 'react';
import { useForm } from 'react-hook-form';
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
import { useSignup } from '../api/signup';
import { signUpSchema } from '../schemas';

type Schema = typeof signUpSchema;
const fieldNames = ['name', 'email', 'password', 'businessName', 'siteName', 'country', 'currency', 'taxMode'] as const;

export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const signup = useSignup();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: '', email: '', password: '', businessName: '', siteName: '', country: '', currency: '', taxMode: undefined },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    signup.mutate({ body: values }, {
      onSuccess: onSignedUp,
      onError: (err) => {
        if (isApiError(err) && err.status === 409) {
          setError('email', { type: 'server', message: 'An account already uses this e-mail. Sign in instead, or use another address.' }, { shouldFocus: true });
        } else setFormError(applyServerErrors(err, setError, fieldNames));
      },
    });
  });

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
        <div className="grid gap-4 sm:grid-cols-2">
          <Field label="Country" error={errors.country?.message}>
            <Select autoComplete="country" {...register('country')}>
              <CountryOptions />
            </Select>
          </Field>
          <Field label="Currency" error={errors.currency?.message}>
            <Select {...register('currency')}>
              <CurrencyOptions />
            </Select>
          </Field>
        </div>
      </fieldset>

      <TaxModeField field={register('taxMode')} error={errors.taxMode?.message} />

      <Button type="submit" busy={signup.isPending} size="lg">
        Create the business account
      </Button>
    </form>
  );
}

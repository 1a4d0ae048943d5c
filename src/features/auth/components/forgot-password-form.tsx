import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { applyServerErrors } from '../../../lib/form-errors';
import { useRequestReset } from '../api/request-reset';
import { forgotPasswordSchema } from '../schemas';

type Schema = typeof forgotPasswordSchema;

export function ForgotPasswordForm() {
  const request = useRequestReset();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(forgotPasswordSchema),
    defaultValues: { email: '' },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    request.mutate({ body: values }, {
      onSuccess: () => setSentTo(values.email),
      onError: (err) => setFormError(applyServerErrors(err, setError, ['email'])),
    });
  });

  if (sentTo)
    return (
      <FormMessage tone="info">
        If an account uses <strong>{sentTo}</strong>, a link to choose a new password is on its way. It works for a limited time; check your
        spam folder if it has not arrived in a few minutes.
      </FormMessage>
    );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <FormMessage>{formError}</FormMessage>
      <Field label="E-mail" hint="We will send a link to choose a new password." error={errors.email?.message}>
        <Input type="email" autoComplete="email" autoFocus {...register('email')} />
      </Field>
      <Button type="submit" busy={request.isPending} size="lg">
        Send the link
      </Button>
    </form>
  );
}

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { isApiError } from '../../../lib/api-client';
import { applyServerErrors } from '../../../lib/form-errors';
import { useCompleteReset } from '../api/complete-reset';
import { resetPasswordSchema } from '../schemas';

type Schema = typeof resetPasswordSchema;

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const complete = useCompleteReset();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(resetPasswordSchema),
    defaultValues: { password: '', confirm: '' },
  });

  const onSubmit = handleSubmit(({ password }) => {
    setFormError(null);
    complete.mutate(
      { body: { token, password } },
      {
        onSuccess: onDone,
        onError: (err) => {
          if (isApiError(err) && err.code === 'invalid_token')
            setFormError('This link has expired or was already used. Ask for a new one from the sign-in page.');
          else setFormError(applyServerErrors(err, setError, ['password']));
        },
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <FormMessage>{formError}</FormMessage>
      <Field label="New password" hint="At least 10 characters." error={errors.password?.message}>
        <Input type="password" autoComplete="new-password" autoFocus {...register('password')} />
      </Field>
      <Field label="New password again" error={errors.confirm?.message}>
        <Input type="password" autoComplete="new-password" {...register('confirm')} />
      </Field>
      <Button type="submit" busy={complete.isPending} size="lg">
        Save the new password
      </Button>
    </form>
  );
}

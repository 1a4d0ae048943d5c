import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button, TextLink } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { isApiError } from '../../../lib/api-client';
import { applyServerErrors } from '../../../lib/form-errors';
import { paths } from '../../../lib/paths';
import { useLogin } from '../api/login';
import { signInSchema } from '../schemas';

type Schema = typeof signInSchema;

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const login = useLogin();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors } } = useForm<z.input<Schema>, unknown, z.output<Schema>>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    login.mutate({ body: values }, {
      onSuccess: onSignedIn,
      onError: (err) => {
        if (isApiError(err) && err.code === 'bad_credentials') setFormError('That e-mail and password do not match an account. Check them and try again.');
        else if (isApiError(err) && err.code === 'throttled') setFormError('Too many attempts. Wait a few minutes, then try again, or reset your password.');
        else setFormError(applyServerErrors(err, setError, ['email', 'password']));
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <FormMessage>{formError}</FormMessage>
      <Field label="E-mail" error={errors.email?.message}>
        <Input type="email" autoComplete="email" autoFocus {...register('email')} />
      </Field>
      <Field label="Password" error={errors.password?.message}>
        <Input type="password" autoComplete="current-password" {...register('password')} />
      </Field>
      <Button type="submit" busy={login.isPending} size="lg">
        Sign in
      </Button>
      <p className="text-sm text-muted">
        <TextLink to={paths.forgotPassword.href()}>Forgotten your password?</TextLink>
      </p>
    </form>
  );
}

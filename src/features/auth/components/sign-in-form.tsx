import { useRef, useState, type FormEvent } from 'react';
import { Button, TextLink } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { FormMessage } from '../../../components/ui/form-message';
import { Input } from '../../../components/ui/input';
import { isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { zodFieldErrors } from '../../../shared/schemas/field-errors';
import { useLogin } from '../api/login';
import { signInSchema } from '../schemas';

type Fields = Partial<Record<'email' | 'password', string>>;

/**
 * The first page anyone sees, so it is kept light: a plain form (no form library) checked with
 * the server's own schema on submit, the server's field messages shown the same way.
 */
export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const login = useLogin();
  const [formError, setFormError] = useState<string | null>(null);
  const [errors, setErrors] = useState<Fields>({});
  const emailRef = useRef<HTMLInputElement>(null);
  const passwordRef = useRef<HTMLInputElement>(null);

  const show = (fields: Fields) => {
    setErrors(fields);
    (fields.email ? emailRef : passwordRef).current?.focus();
  };

  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    if (login.isPending) return;
    setFormError(null);
    const data = new FormData(e.currentTarget);
    const parsed = signInSchema.safeParse({ email: String(data.get('email') ?? ''), password: String(data.get('password') ?? '') });
    if (!parsed.success) return show(zodFieldErrors(parsed.error));
    setErrors({});
    login.mutate({ body: parsed.data }, {
      onSuccess: onSignedIn,
      onError: (err) => {
        if (isApiError(err) && err.code === 'bad_credentials') setFormError('That e-mail and password do not match an account. Check them and try again.');
        else if (isApiError(err) && err.code === 'throttled') setFormError('Too many attempts. Wait a few minutes, then try again, or reset your password.');
        else if (isApiError(err) && Object.keys(err.fields).length > 0) show(err.fields);
        else setFormError(isApiError(err) ? err.message : 'Something went wrong. Try again.');
      },
    });
  };

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <FormMessage>{formError}</FormMessage>
      <Field label="E-mail" error={errors.email}>
        <Input ref={emailRef} name="email" type="email" autoComplete="email" autoFocus />
      </Field>
      <Field label="Password" error={errors.password}>
        <Input ref={passwordRef} name="password" type="password" autoComplete="current-password" />
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

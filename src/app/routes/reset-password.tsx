import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ButtonLink, TextLink } from '../../components/ui/button';
import { FormMessage } from '../../components/ui/form-message';
import { paths } from '../../lib/paths';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';
import { AuthCard } from '../layout/auth-card';

export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [done, setDone] = useState(false);

  return (
    <AuthCard title="Choose a new password" footer={<TextLink to={paths.signIn.href()}>Back to sign in</TextLink>}>
      {done ? (
        <div className="flex flex-col gap-4">
          <FormMessage tone="info">Your password is changed. Sign in with the new one.</FormMessage>
          <ButtonLink to={paths.signIn.href()} size="lg">
            Sign in
          </ButtonLink>
        </div>
      ) : token ? (
        <ResetPasswordForm token={token} onDone={() => setDone(true)} />
      ) : (
        <FormMessage>
          This link is incomplete. Open the link from the e-mail again, or <TextLink to={paths.forgotPassword.href()}>ask for a new one</TextLink>.
        </FormMessage>
      )}
    </AuthCard>
  );
}

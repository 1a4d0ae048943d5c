import { TextLink } from '../../components/ui/button';
import { paths } from '../../lib/paths';
import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';
import { useConfig } from '../../features/config/api/get-config';
import { AuthCard } from '../layout/auth-card';

export function ForgotPasswordRoute() {
  const config = useConfig();
  const mailbox = config.data?.devMailboxUrl;
  return (
    <AuthCard
      title="Choose a new password"
      intro="Enter the e-mail you sign in with and we will send you a link."
      footer={
        <>
          <TextLink to={paths.signIn.href()}>Back to sign in</TextLink>
          {mailbox && (
            <p className="mt-3">
              Running locally: mail goes to the{' '}
              <a href={mailbox} target="_blank" rel="noreferrer" className="font-medium text-ink underline decoration-copper decoration-2 underline-offset-2">
                local mailbox
              </a>
              .
            </p>
          )}
        </>
      }
    >
      <ForgotPasswordForm />
    </AuthCard>
  );
}

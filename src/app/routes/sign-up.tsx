import { useNavigate } from 'react-router-dom';
import { TextLink } from '../../components/ui/button';
import { paths } from '../../lib/paths';
import { SignUpForm } from '../../features/auth/components/sign-up-form';
import { AuthCard } from '../layout/auth-card';

export function SignUpRoute() {
  const navigate = useNavigate();
  return (
    <AuthCard
      title="Set up your business"
      wide
      intro="One account for the owner; you can invite your team afterwards."
      footer={
        <>
          Already have an account? <TextLink to={paths.signIn.href()}>Sign in</TextLink>
        </>
      }
    >
      <SignUpForm onSignedUp={() => navigate(paths.gettingStarted.href(), { replace: true })} />
    </AuthCard>
  );
}

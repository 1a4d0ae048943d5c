import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { TextLink } from '../../components/ui/button';
import { paths, safeNext } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { AuthCard } from '../layout/auth-card';

export function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  const next = safeNext(params.get('next'));
  if (me.data) return <Navigate to={next} replace />;
  return (
    <AuthCard
      title="Sign in"
      footer={
        <>
          New to Tamp &amp; Tally? <TextLink to={paths.signUp.href()}>Set up your business</TextLink>
        </>
      }
    >
      <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
    </AuthCard>
  );
}

import { useNavigate, useSearchParams } from 'react-router-dom';
import { paths } from '../../lib/paths';
import { AcceptInvitationForm } from '../../features/auth/components/accept-invitation-form';
import { AuthCard } from '../layout/auth-card';

export function AcceptInviteRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  return (
    <AuthCard title="Join your team">
      <AcceptInvitationForm token={params.get('token') ?? ''} onJoined={() => navigate(paths.home.href(), { replace: true })} />
    </AuthCard>
  );
}

import { useNavigate, useParams } from 'react-router';
import { Card } from '../components/Card';
import { SignInForm } from '../features/auth/components/SignInForm';
import { SignOutButton } from '../features/auth/components/SignOutButton';
import { SignUpForm } from '../features/auth/components/SignUpForm';
import { InvitationPanel } from '../features/team/components/InvitationPanel';
import { paths } from '../lib/paths';

/** `/invitations/:token`: what the invitation offers, and the way in for whoever opens it. */
export function InvitationRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  return (
    <InvitationPanel
      token={token}
      onAccepted={(team) => navigate(paths.team.href(team.id), { replace: true })}
      signOutButton={<SignOutButton variant="secondary" landing="here" />}
      signedOutActions={(email) => (
        <div className="grid gap-4 md:grid-cols-2">
          <Card title="New to Spoolbook?" titleAs="h2">
            <SignUpForm defaultEmail={email} />
          </Card>
          <Card title="Already have an account?" titleAs="h2">
            <SignInForm defaultEmail={email} />
          </Card>
        </div>
      )}
    />
  );
}

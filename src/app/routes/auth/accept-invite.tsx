import { Link, useNavigate, useParams } from 'react-router-dom';
import { useAcceptInvitation, useInvitation } from '../../../features/auth/api/tokens';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { SetPasswordForm } from '../../../features/auth/components/set-password-form';
import { Loading } from '../../../components/ui/card';
import { homeFor, paths } from '../../../config/paths';

export function AcceptInvitePage() {
  const token = useParams().token ?? '';
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  return (
    <AuthCard title="Join your team on Browseline">
      {invitation.isPending ? (
        <Loading />
      ) : invitation.isError ? (
        <div className="flex flex-col gap-3 text-sm">
          <p role="alert" className="text-clay">{invitation.error.message}</p>
          <Link to={paths.login} className="text-moss-deep underline">Go to sign in</Link>
        </div>
      ) : (
        <>
          <p className="mb-4 text-sm text-slate">
            Welcome, {invitation.data.name}. {invitation.data.firmName} invited {invitation.data.email}. Choose a password to finish.
          </p>
          <SetPasswordForm
            token={token}
            submitLabel="Create my account"
            busy={accept.isPending}
            error={accept.error}
            onSubmit={(v) => accept.mutate(v, { onSuccess: (user) => navigate(homeFor(user.role), { replace: true }) })}
          />
        </>
      )}
    </AuthCard>
  );
}

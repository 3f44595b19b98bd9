import { Link, useNavigate, useParams } from 'react-router-dom';
import { useAcceptInvitation, useInvitation } from '../../../features/auth/api/tokens';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { SetPasswordForm } from '../../../features/auth/components/set-password-form';
import { Loading } from '../../../components/ui/card';
import { homeFor, paths } from '../../../config/paths';
import { invitationIntro, invitationTitle } from '../../../features/auth/lib/invitation-words';

export function AcceptInvitePage() {
  const token = useParams().token ?? '';
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  return (
    <AuthCard title={invitationTitle(invitation.data?.role)}>
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
            {invitationIntro(invitation.data)}
          </p>
          <SetPasswordForm
            token={token}
            submitLabel={invitation.data.role === 'client' ? 'Open my portal' : 'Create my account'}
            busy={accept.isPending}
            error={accept.error}
            onSubmit={(v) => accept.mutate(v, { onSuccess: (user) => navigate(homeFor(user.role), { replace: true }) })}
          />
        </>
      )}
    </AuthCard>
  );
}

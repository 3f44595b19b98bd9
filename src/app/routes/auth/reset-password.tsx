import { Link, useParams } from 'react-router-dom';
import { useCompletePasswordReset, useResetCheck } from '../../../features/auth/api/tokens';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { SetPasswordForm } from '../../../features/auth/components/set-password-form';
import { Loading } from '../../../components/ui/card';
import { paths } from '../../../config/paths';

export function ResetPasswordPage() {
  const token = useParams().token ?? '';
  const check = useResetCheck(token);
  const complete = useCompletePasswordReset();
  return (
    <AuthCard title="Choose a new password">
      {check.isPending ? (
        <Loading />
      ) : check.isError ? (
        <div className="flex flex-col gap-3 text-sm">
          <p role="alert" className="text-clay">{check.error.message}</p>
          <Link to={paths.forgotPassword} className="text-moss-deep underline">Ask for a new link</Link>
        </div>
      ) : complete.isSuccess ? (
        <div className="flex flex-col gap-3 text-sm">
          <p role="status">{complete.data.data.message}</p>
          <Link to={paths.login} className="text-moss-deep underline">Sign in</Link>
        </div>
      ) : (
        <>
          <p className="mb-4 text-sm text-slate">For {check.data.email}</p>
          <SetPasswordForm token={token} submitLabel="Save the new password" busy={complete.isPending} error={complete.error} onSubmit={(v) => complete.mutate(v)} />
        </>
      )}
    </AuthCard>
  );
}
